package org.liepath.validation;

import org.liepath.core.Operator;
import org.liepath.core.Superoperator;
import org.liepath.testing.Seeds;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/** Test-only channels built from textbook definitions, independent of the code under test. */
final class Channels {
    private Channels() {
    }

    /**
     * Amplitude damping with Kraus operators E0 = [[1, 0], [0, √(1−γ)]], E1 = [[0, √γ], [0, 0]] (M.A. Nielsen,
     * I.L. Chuang, Quantum Computation and Quantum Information, CUP 2000, §8.3.5).
     */
    static List<Operator> amplitudeDampingKraus(double gamma) {
        return List.of(Operator.real(new double[][]{{1, 0}, {0, Math.sqrt(1 - gamma)}}),
                Operator.real(new double[][]{{0, Math.sqrt(gamma)}, {0, 0}}));
    }

    /** The transpose map X ↦ Xᵀ: S = K, the commutation matrix K[j + n i, i + n j] = 1. */
    static Superoperator transpose(int n) {
        double[][] k = new double[n * n][n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                k[j + n * i][i + n * j] = 1;
            }
        }
        return Superoperator.ofMatrix(Operator.real(k));
    }

    /**
     * Random Kraus operators by Stinespring dilation: a random unitary V = exp(−iG) on system ⊗ environment (G a
     * random Hermitian), K_k = (I ⊗ ⟨k|) V (I ⊗ |0⟩). Σ K_k† K_k = I holds by construction.
     */
    static List<Operator> randomKraus(Random r, int d, int env) {
        Operator v = Seeds.randomHermitian(r, d * env).expMinusI(1.0);
        List<Operator> ks = new ArrayList<>();
        for (int k = 0; k < env; k++) {
            double[] re = new double[d * d], im = new double[d * d];
            for (int i = 0; i < d; i++) {
                for (int a = 0; a < d; a++) {
                    re[i * d + a] = v.re(i * env + k, a * env);
                    im[i * d + a] = v.im(i * env + k, a * env);
                }
            }
            ks.add(Operator.ofPlanar(d, re, im));
        }
        return ks;
    }
}
