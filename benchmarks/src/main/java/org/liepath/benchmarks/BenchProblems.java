package org.liepath.benchmarks;

import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;

import java.util.Random;

/**
 * The driven problems of the work–precision benchmarks (all of our own invention; seeded, so every run sees the same
 * matrices). Conventions: ħ = 1, dU/dt = −i H(t) U on [t0, t1].
 */
enum BenchProblems {
    /** (a) A driven three-level ladder with three smooth drives on [0, 6]. */
    THREE_LEVEL(0, 6, 4096) {
        @Override
        Hamiltonian hamiltonian() {
            Operator x01 = Operator.unit(3, 0, 1).plus(Operator.unit(3, 1, 0));
            Operator x12 = Operator.unit(3, 1, 2).plus(Operator.unit(3, 2, 1));
            Operator x02 = Operator.unit(3, 0, 2).plus(Operator.unit(3, 2, 0));
            return Hamiltonian.builder(3)
                    .term(1.0, Operator.diagonal(0, 1, 2.3))
                    .term(x01, Drive.cosine(0.3, 1.1))
                    .term(x12, Drive.sine(0.2, 0.7, 0))
                    .term(x02, Drive.cosine(0.15, 1.7, 0.4))
                    .build();
        }
    },
    /**
     * (b) 16 levels: a strong static part (level energies spread over [0, 20] plus a static random coupling of norm
     * ~1) and three weak drives 0.05 cos(ω_j t + φ_j) V_j (V_j random Hermitian of norm ~1), on [0, 5].
     */
    SIXTEEN_LEVEL(0, 5, 4096) {
        @Override
        Hamiltonian hamiltonian() {
            Random r = new Random(16);
            int n = 16;
            double[] e = new double[n];
            for (int k = 0; k < n; k++) {
                e[k] = 20.0 * k / (n - 1) + 0.3 * r.nextDouble();
            }
            Hamiltonian.Builder b = Hamiltonian.builder(n).term(1.0, Operator.diagonal(e))
                    .term(1.0, randomHermitian(r, n, 1.0));
            for (int j = 0; j < 3; j++) {
                b.term(randomHermitian(r, n, 1.0), Drive.cosine(0.05, 0.5 + 3 * r.nextDouble(), 2 * Math.PI * r.nextDouble()));
            }
            return b.build();
        }
    },
    /** (c) 64 levels: a random static Hermitian part of norm ~3 and two random drives of amplitude 0.5, on [0, 2]. */
    SIXTY_FOUR_LEVEL(0, 2, 256) {
        @Override
        Hamiltonian hamiltonian() {
            Random r = new Random(64);
            int n = 64;
            Hamiltonian.Builder b = Hamiltonian.builder(n).term(1.0, randomHermitian(r, n, 3.0));
            b.term(randomHermitian(r, n, 1.0), Drive.cosine(0.5, 1.3, 0.2));
            b.term(randomHermitian(r, n, 1.0), Drive.sine(0.5, 2.1, 0.7));
            return b.build();
        }
    };

    final double t0, t1;
    /** magnus8 steps of the reference propagator (its error is checked against half as many steps and DP853). */
    final int referenceSteps;

    BenchProblems(double t0, double t1, int referenceSteps) {
        this.t0 = t0;
        this.t1 = t1;
        this.referenceSteps = referenceSteps;
    }

    abstract Hamiltonian hamiltonian();

    /** (G + G†)/2 for a complex Gaussian G (entries of variance 1), scaled so that its spectral radius is about
     * {@code norm} (Wigner semicircle edge 2√n). */
    static Operator randomHermitian(Random r, int n, double norm) {
        double[] re = new double[n * n], im = new double[n * n];
        for (int k = 0; k < n * n; k++) {
            re[k] = r.nextGaussian();
            im[k] = r.nextGaussian();
        }
        Operator g = Operator.ofPlanar(n, re, im);
        return g.plus(g.dagger()).scale(norm / (2 * Math.sqrt(n)));
    }
}
