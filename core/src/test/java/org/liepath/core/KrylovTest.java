package org.liepath.core;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.internal.KrylovWorkspace;
import org.liepath.testing.Seeds;

import java.util.Arrays;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@link Krylov} against the dense exponential, its error estimate against the true error, happy breakdown, and
 * Arnoldi on a GKLS generator.
 *
 * <p>Error-estimate checks (Y. Saad, SIAM J. Numer. Anal. 29 (1992) 209–228; R.B. Sidje, ACM TOMS 24 (1998)
 * 130–156): the generalised-residual estimate is asymptotically exact once the Krylov error decays
 * superlinearly (M. Hochbruck, C. Lubich, SIAM J. Numer. Anal. 34 (1997) 1911–1925), so we require
 * true ≤ 2·estimate + floor and estimate ≤ 10·true + floor, where floor = 50·n·u·‖ψ‖ covers the rounding of both
 * the Krylov result and the dense reference (whose own error is a few n·u).
 */
class KrylovTest {
    private static final double U = 0x1p-53;

    static StateVector randomState(Random r, int n) {
        double[] re = new double[n], im = new double[n];
        for (int i = 0; i < n; i++) {
            re[i] = r.nextGaussian();
            im[i] = r.nextGaussian();
        }
        return StateVector.of(re, im).normalized();
    }

    /** Random Hermitian with spectrum in about [−2, 2] (Wigner semicircle of radius 2 for entries of variance 1/n). */
    static Operator wigner(Random r, int n) {
        return Seeds.randomHermitian(r, n).scale(1 / Math.sqrt(n));
    }

    /** exp(−itH)ψ = V diag(e^{−itλ}) V†ψ from one eigendecomposition (no n×n×n product). */
    static StateVector exactByEigen(Operator h, double t, StateVector psi) {
        int n = h.dim();
        double[] lam = new double[n], vr = new double[n * n], vi = new double[n * n];
        assertTrue(new org.liepath.core.internal.HermitianEigen(n).compute(h.reArray(), h.imArray(), lam, vr, vi));
        double[] out = new double[2 * n];
        for (int k = 0; k < n; k++) {
            double cr = 0, ci = 0; // (V†ψ)_k
            for (int i = 0; i < n; i++) {
                cr += vr[i * n + k] * psi.re(i) + vi[i * n + k] * psi.im(i);
                ci += vr[i * n + k] * psi.im(i) - vi[i * n + k] * psi.re(i);
            }
            double c = Math.cos(t * lam[k]), s = -Math.sin(t * lam[k]);
            double pr = cr * c - ci * s, pi = cr * s + ci * c;
            for (int i = 0; i < n; i++) {
                out[i] += vr[i * n + k] * pr - vi[i * n + k] * pi;
                out[n + i] += vr[i * n + k] * pi + vi[i * n + k] * pr;
            }
        }
        return StateVector.of(java.util.Arrays.copyOf(out, n), java.util.Arrays.copyOfRange(out, n, 2 * n));
    }

    private static void assertEstimateHonest(Krylov.Result res, double trueErr, int n, String what) {
        double floor = 50 * n * U;
        assertTrue(trueErr <= 2 * res.errorEstimate() + floor,
                what + ": true error " + trueErr + " not bounded by estimate " + res.errorEstimate());
        assertTrue(res.errorEstimate() <= 10 * trueErr + floor,
                what + ": estimate " + res.errorEstimate() + " far above true error " + trueErr);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void lanczosAgainstDenseExponential(long seed) {
        Random r = new Random(seed);
        int n = 10 + r.nextInt(190);
        Operator h = wigner(r, n);
        StateVector psi = randomState(r, n);
        double t = 0.5 + 9.5 * r.nextDouble();
        StateVector exact = exactByEigen(h, t, psi);
        // a loose run with a small basis (errors well above rounding: tests the estimate) and a tight one
        Krylov.Result loose = Krylov.expMinusI(h, t, psi, 1e-6, 10);
        double errLoose = loose.state().distance(exact);
        assertTrue(errLoose <= 1.2e-6 * 2, "loose: " + errLoose);
        assertEstimateHonest(loose, errLoose, n, "loose n = " + n + ", t = " + t);
        Krylov.Result tight = Krylov.expMinusI(h, t, psi, 1e-12);
        double errTight = tight.state().distance(exact);
        assertTrue(errTight <= 2.4e-12 + 50 * n * U, "tight: " + errTight);
        assertEstimateHonest(tight, errTight, n, "tight n = " + n);
        // unitary evolution keeps the norm up to the error
        assertEquals(1.0, tight.state().norm(), 2.4e-12 + 50 * n * U);
        assertTrue(tight.matrixVectorProducts() >= tight.substeps());
    }

    @Test
    void lanczosAtDimension500() {
        // Krylov against dense expm for n ≤ 500 (common practice for validating Krylov actions) (dense reference: eigendecomposition)
        Random r = new Random(500);
        int n = 500;
        Operator h = wigner(r, n);
        StateVector psi = randomState(r, n);
        double t = 6;
        StateVector exact = exactByEigen(h, t, psi);
        for (int m : new int[]{10, 20, 30}) {
            Krylov.Result res = Krylov.expMinusI(h, t, psi, 1e-8, m);
            double err = res.state().distance(exact);
            assertTrue(err <= 2.4e-8, "m = " + m + ": " + err);
            assertEstimateHonest(res, err, n, "n = 500, m = " + m);
            assertTrue(res.krylovDimension() == m, "dimension " + res.krylovDimension());
        }
    }

    @Test
    void arnoldiAgreesWithLanczosOnHermitianGenerators() {
        // exp(t(−iH))v by the general Arnoldi path equals exp(−itH)v by Lanczos (same mathematics, same estimate)
        Random r = new Random(42);
        int n = 120;
        Operator h = wigner(r, n);
        StateVector psi = randomState(r, n);
        StateVector exact = exactByEigen(h, 3.0, psi);
        Krylov.Result arn = Krylov.expAction(h.timesI().scale(-1), 3.0, psi, 1e-10);
        double err = arn.state().distance(exact);
        assertTrue(err <= 2.4e-10, "Arnoldi: " + err);
        assertEstimateHonest(arn, err, n, "Arnoldi on −iH");
    }

    @Test
    void happyBreakdownIsExactInOneStep() {
        // ψ in the span of three eigenvectors of H = diag(1, …, n): the Krylov space is invariant after three
        // vectors, and the projected exponential is then exact (Saad 1992, Prop. 2.2 [from memory]: exactness on an
        // invariant Krylov subspace)
        int n = 80;
        double[] diag = new double[n];
        for (int i = 0; i < n; i++) {
            diag[i] = 1 + i;
        }
        Operator h = Operator.diagonal(diag);
        double[] re = new double[n], im = new double[n];
        re[0] = 0.6;
        re[17] = 0.48;
        im[63] = 0.64;
        StateVector psi = StateVector.of(re, im);
        double t = 25.0; // t‖H‖ = 2000: many sub-steps would be needed without the breakdown
        Krylov.Result res = Krylov.expMinusI(h, t, psi, 1e-12);
        assertEquals(3, res.krylovDimension());
        assertEquals(1, res.substeps());
        for (int k : new int[]{0, 17, 63}) {
            double ph = -t * diag[k];
            double er = psi.re(k) * Math.cos(ph) - psi.im(k) * Math.sin(ph);
            double ei = psi.re(k) * Math.sin(ph) + psi.im(k) * Math.cos(ph);
            assertEquals(er, res.state().re(k), 1e-12, "re " + k);
            assertEquals(ei, res.state().im(k), 1e-12, "im " + k);
        }
        assertEquals(0.0, res.state().re(5), 1e-14);
    }

    @Test
    void smallDimensionsAreExact() {
        // n ≤ m: the Krylov space is the whole space after n vectors; the result equals the dense propagator
        Random r = new Random(3);
        for (int n = 1; n <= 6; n++) {
            Operator h = Seeds.randomHermitian(r, n);
            StateVector psi = randomState(r, n);
            StateVector exact = psi.apply(h.expMinusI(4.0));
            Krylov.Result res = Krylov.expMinusI(h, 4.0, psi, 1e-10);
            assertTrue(res.state().distance(exact) <= 1e-13, "n = " + n);
        }
    }

    @Test
    void backwardRunUndoesForwardRun() {
        Random r = new Random(8);
        int n = 150;
        Operator h = wigner(r, n);
        StateVector psi = randomState(r, n);
        StateVector there = Krylov.expMinusI(h, 7.0, psi, 1e-11).state();
        StateVector back = Krylov.expMinusI(h, -7.0, there, 1e-11).state();
        assertTrue(back.distance(psi) <= 5e-11, "round trip " + back.distance(psi));
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void arnoldiOnRandomGklsGenerator(long seed) {
        // a random GKLS generator (non-normal superoperator on d×d matrices, column stacking) applied to a random
        // density matrix: Arnoldi against the dense exponential of the n²×n² generator (Padé, Higham 2005)
        Random r = new Random(seed);
        int d = 3 + r.nextInt(4);
        Operator hs = Seeds.randomHermitian(r, d);
        Lindbladian.Builder b = Lindbladian.builder(Hamiltonian.builder(d).term(1.0, hs).build());
        int jumps = 1 + r.nextInt(3);
        for (int k = 0; k < jumps; k++) {
            b.jump(0.05 + r.nextDouble(), Seeds.randomMatrix(r, d).scale(1 / Math.sqrt(d)));
        }
        Superoperator gen = b.build().at(0.0);
        Operator s = gen.matrix();
        // ρ0 = |φ⟩⟨φ| for a random φ, column-stacked
        StateVector phi = randomState(r, d);
        Operator rho = phi.toDensity();
        double[] vr = new double[d * d], vi = new double[d * d];
        for (int i = 0; i < d; i++) {
            for (int j = 0; j < d; j++) {
                vr[i + d * j] = rho.re(i, j);
                vi[i + d * j] = rho.im(i, j);
            }
        }
        StateVector v = StateVector.of(vr, vi);
        double t = 0.2 + 3 * r.nextDouble();
        StateVector exact = v.apply(s.scale(t).exp());
        Krylov.Result res = Krylov.expAction(s, t, v, 1e-9, 12);
        double err = res.state().distance(exact);
        int n = d * d;
        // the dense reference carries κ·u relative error with κ ≈ t‖S‖ ≲ 50: floor 50·n·u·(1 + t‖S‖₁)
        double floor = 50 * n * U * (1 + t * s.norm1());
        assertTrue(err <= 2.4e-9 * v.norm() + floor, "d = " + d + ": " + err);
        assertTrue(err <= 2 * res.errorEstimate() + floor, "estimate " + res.errorEstimate() + " vs " + err);
        // the trace of ρ(t) is preserved by a GKLS semigroup: Σ_i ρ_ii = 1
        double tr = 0;
        for (int i = 0; i < d; i++) {
            tr += res.state().re(i + d * i);
        }
        assertEquals(1.0, tr, 2.4e-9 + floor);
    }

    @Test
    void stepLimitIsReportedNotAHang() {
        // |t|·‖H‖ = 1e9 with a basis of 2 vectors would need ~1e8 sub-steps: the call stops at the documented
        // limit and says so
        Random r = new Random(1);
        Operator h = wigner(r, 4).scale(1e3);
        StateVector psi = randomState(r, 4);
        InvalidInputException e = org.junit.jupiter.api.Assertions.assertThrows(InvalidInputException.class,
                () -> Krylov.expMinusI(h, 1e6, psi, 1e-10, 2));
        assertEquals(InvalidInputException.Reason.LIMIT_EXCEEDED, e.reason());
        assertTrue(e.getMessage().contains("t = 1.00000e+06"), e.getMessage());
    }

    @Test
    void workspaceGivesTheSameBitsAsTheFacadeAndAllocatesNothingObservable() {
        Random r = new Random(77);
        int n = 64;
        Operator h = wigner(r, n);
        StateVector psi = randomState(r, n);
        Krylov.Result res = Krylov.expMinusI(h, 2.5, psi, 1e-10);
        KrylovWorkspace ws = new KrylovWorkspace(n, Krylov.DEFAULT_DIMENSION);
        double[] re = new double[n], im = new double[n];
        psi.copyTo(re, im);
        double[] hr = h.reArray(), hi = h.imArray();
        for (int rep = 0; rep < 2; rep++) {
            double[] outR = re.clone(), outI = im.clone();
            assertTrue(ws.expMinusI(hr, hi, 2.5, outR, outI, 1e-10, outR, outI)); // in place
            for (int i = 0; i < n; i++) {
                assertEquals(res.state().re(i), outR[i], 0.0);
                assertEquals(res.state().im(i), outI[i], 0.0);
            }
            assertEquals(res.substeps(), ws.substeps());
            assertEquals(res.errorEstimate(), ws.errorEstimate(), 0.0);
        }
        assertTrue(Arrays.equals(hr, h.reArray()), "matrix untouched");
    }
}
