package org.liepath.integrators;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;

import java.util.List;
import java.util.Random;

/** Shared test problems. */
final class Fixtures {
    private Fixtures() {
    }

    /** Every scheme with a step kernel or the reference, in a fixed order (interaction-picture variants last). */
    static List<Scheme> schemes() {
        return List.of(Scheme.exponentialMidpoint(), Scheme.magnus4(), Scheme.magnus6(), Scheme.magnus8(),
                Scheme.commutatorFree4(), Scheme.commutatorFree4Opt(), Scheme.commutatorFree6(),
                Scheme.piecewiseExact(), Scheme.reference(), Scheme.exponentialMidpoint().inInteractionPicture(),
                Scheme.magnus4().inInteractionPicture(), Scheme.magnus6().inInteractionPicture(),
                Scheme.magnus8().inInteractionPicture());
    }

    /** Schemes with a fixed-step kernel (interaction-picture variants last). */
    static List<Scheme> steppable() {
        return List.of(Scheme.exponentialMidpoint(), Scheme.magnus4(), Scheme.magnus6(), Scheme.magnus8(),
                Scheme.commutatorFree4(), Scheme.commutatorFree4Opt(), Scheme.commutatorFree6(),
                Scheme.exponentialMidpoint().inInteractionPicture(), Scheme.magnus4().inInteractionPicture(),
                Scheme.magnus6().inInteractionPicture(), Scheme.magnus8().inInteractionPicture());
    }

    /** The schemes of {@link #steppable} that also serve GKLS generators (not the interaction-picture ones). */
    static List<Scheme> steppableOpen() {
        return steppable().stream().filter(s -> !s.isInteractionPicture()).collect(java.util.stream.Collectors.toList());
    }

    /** A random real symmetric n×n matrix (entries N(0, 1) symmetrised). */
    static double[][] randomSymmetric(Random r, int n) {
        double[][] a = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                a[i][j] = a[j][i] = r.nextGaussian();
            }
        }
        return a;
    }

    /**
     * exp(−i t H) for real symmetric H from Commons Math's symmetric eigendecomposition H = V Λ Vᵀ:
     * V diag(e^{−iλt}) Vᵀ (an outside reference for the engine's exponentials).
     */
    static Operator expMinusIReference(double[][] h, double t) {
        int n = h.length;
        EigenDecomposition ed = new EigenDecomposition(new Array2DRowRealMatrix(h));
        RealMatrix v = ed.getV();
        double[] lambda = ed.getRealEigenvalues();
        double[][] re = new double[n][n], im = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                for (int k = 0; k < n; k++) {
                    double w = v.getEntry(i, k) * v.getEntry(j, k);
                    re[i][j] += w * Math.cos(lambda[k] * t);
                    im[i][j] -= w * Math.sin(lambda[k] * t);
                }
            }
        }
        return Operator.of(re, im);
    }

    /** A driven qubit: H = 0.5 Z + 0.7 cos(1.3 t) X + 0.3 sin(0.9 t) Y. */
    static Hamiltonian drivenQubit() {
        return Hamiltonian.builder(2).term(0.5, Pauli.string("Z")).term(Pauli.string("X"), Drive.cosine(0.7, 1.3))
                .term(Pauli.string("Y"), Drive.sine(0.3, 0.9, 0.0)).build();
    }

    /** A driven 4-level system with a non-smooth drive (a window with breakpoints at 0.3 and 0.8). */
    static Hamiltonian drivenFour(long seed) {
        Random r = new Random(seed);
        return Hamiltonian.builder(4).term(1.0, Operator.real(randomSymmetric(r, 4)))
                .term(Operator.real(randomSymmetric(r, 4)), Drive.cosine(0.8, 2.0))
                .term(Operator.real(randomSymmetric(r, 4)), Drive.cosine(0.5, 3.0).window(0.3, 0.8)).build();
    }

    /** A piecewise-constant drive on X with segments [0, 0.4), [0.4, 1), then 0: amplitudes 0.9, −0.4. */
    static Hamiltonian piecewiseQubit() {
        Drive d = Drive.piecewiseConstant(new double[]{0.0, 0.4, 1.0}, new double[]{0.9, -0.4});
        return Hamiltonian.builder(2).term(0.6, Pauli.string("Z")).term(Pauli.string("X"), d).build();
    }

    /** ‖U†U − I‖_F. */
    static double unitarityDefect(Operator u) {
        return u.dagger().times(u).distance(Operator.identity(u.dim()));
    }
}
