package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.Superoperator;
import org.liepath.testing.Seeds;

import java.util.Arrays;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Open-system (GKLS) evolution against closed forms and independently computed transients.
 *
 * <p>Convention: dρ/dt = −i[H,ρ] + Σ_k γ_k (L_k ρ L_k† − ½{L_k†L_k, ρ}); atom basis |e⟩ = (1,0)ᵀ, |g⟩ = (0,1)ᵀ,
 * σ− = |g⟩⟨e|; rotating frame H = −(Δ/2)σz + (Ω/2)σx; decay L = σ− at rate Γ; pure dephasing L = σz at rate γφ/2.
 */
class OpenSystemTest {
    static final Operator SIGMA_MINUS = Operator.unit(2, 1, 0);
    static final Operator EXCITED = Operator.unit(2, 0, 0), GROUND = Operator.unit(2, 1, 1);
    /** Tolerance of the adaptive runs; the transients decay, so the global error stays near it (common practice). */
    static final double TOL = 1e-11;

    static Lindbladian atom(double rabi, double detuning, double gamma, double dephasing) {
        Hamiltonian h = Hamiltonian.builder(2).term(-detuning / 2, ReferenceProblems.Z).term(rabi / 2, ReferenceProblems.X)
                .build();
        Lindbladian.Builder b = Lindbladian.builder(h).jump(gamma, SIGMA_MINUS);
        if (dephasing > 0) {
            b.jump(dephasing / 2, ReferenceProblems.Z);
        }
        return b.build();
    }

    static Operator evolve(Lindbladian l, Operator rho, double t0, double t1) {
        Evolution ev = Evolve.of(l).over(t0, t1).tolerance(TOL).density(rho).run();
        assertTrue(ev.status().isSuccess(), () -> ev.status().toString());
        return ev.density();
    }

    @Test
    void freeDecayFollowsTheT1AndT2ClosedForms() {
        // H = 0: ρ_ee(t) = ρ_ee(0) e^{−Γt}, |ρ_eg(t)| = |ρ_eg(0)| e^{−(Γ/2 + γφ)t}
        // (F. Bloch, Phys. Rev. 70, 460 (1946)); Γ = 1, γφ = 0.3, t = 1.5, ρ(0) = |+⟩⟨+|
        Hamiltonian zero = Hamiltonian.builder(2).term(0.0, ReferenceProblems.Z).build();
        Lindbladian l = Lindbladian.builder(zero).jump(1, SIGMA_MINUS).jump(0.15, ReferenceProblems.Z).build();
        Operator plus = Operator.real(new double[][]{{0.5, 0.5}, {0.5, 0.5}});
        Operator rho = evolve(l, plus, 0, 1.5);
        assertEquals(0.111565080074214914, rho.re(0, 0), 1e-10);
        assertEquals(0.150597105956101048, rho.get(0, 1).abs(), 1e-10);
        for (double t : new double[]{0.2, 1, 3.7}) {
            Operator r = evolve(l, plus, 0, t);
            assertEquals(0.5 * Math.exp(-t), r.re(0, 0), 1e-10, "T1 at t = " + t);
            assertEquals(0.5 * Math.exp(-(0.5 + 0.3) * t), r.get(0, 1).abs(), 1e-10, "T2 at t = " + t);
        }
    }

    /**
     * ρ_ee = ½(Ω²γ2/Γ)/(γ2² + Δ² + Ω²γ2/Γ), γ2 = Γ/2 + γφ; ρ_eg = (Ω/2)(Δ − iγ2)(ρ_gg − ρ_ee)/(Δ² + γ2²)
     * (optical Bloch equations: R. Loudon, The Quantum Theory of Light, OUP; C. J. Foot, Atomic Physics (OUP 2005)
     * §7.3; L. Allen, J. H. Eberly, Optical Resonance and Two-Level Atoms (Wiley 1975)).
     */
    @ParameterizedTest(name = "Ω = {0}, Δ = {1}, Γ = {2}, γφ = {3}")
    @CsvSource({"1, 0, 1, 0, 0.333333333333333333, 0, -0.333333333333333333",
            "2, 0.5, 1, 0, 0.4, 0.2, -0.2",
            "0.3, 1, 0.2, 0, 0.0213270142180094787, 0.14218009478673, -0.014218009478673",
            "1, 0.5, 1, 0.3, 0.236686390532544379, 0.14792899408284, -0.236686390532544"})
    void opticalBlochSteadyStateByLongTimeEvolution(double rabi, double detuning, double gamma, double dephasing,
                                                    double ee, double egRe, double egIm) {
        double g2 = gamma / 2 + dephasing, s = rabi * rabi * g2 / gamma;
        double formula = 0.5 * s / (g2 * g2 + detuning * detuning + s);
        assertEquals(ee, formula, 1e-15, "formula vs table");
        // slowest relaxation rate ≥ Γ/2: evolve for 40/(Γ/2) so the transient e^{−40} is below the tolerance
        Operator rho = evolve(atom(rabi, detuning, gamma, dephasing), GROUND, 0, 80 / gamma);
        assertEquals(ee, rho.re(0, 0), 1e-8);
        assertEquals(egRe, rho.re(0, 1), 1e-8);
        assertEquals(egIm, rho.im(0, 1), 1e-8);
    }

    @ParameterizedTest(name = "t = {0}")
    @CsvSource({"1, 0.1406423163699099, 0.082392014145719433, -0.3315835562121646",
            "2, 0.28186689768765842, 0.192940481530519, -0.3583900322055541",
            "5, 0.25118781368886936, 0.24450753083506668, -0.23899412144258958"})
    void opticalBlochTransient(double t, double ee, double egRe, double egIm) {
        // Ω = 1, Δ = 0.5, Γ = 1, ρ(0) = |g⟩⟨g|: computed independently (mpmath expm of the 4×4 Liouvillian;
        // DOP853 agrees to 1e-13)
        Operator rho = evolve(atom(1, 0.5, 1, 0), GROUND, 0, t);
        assertEquals(ee, rho.re(0, 0), 1e-10);
        assertEquals(egRe, rho.re(0, 1), 1e-10);
        assertEquals(egIm, rho.im(0, 1), 1e-10);
    }

    @Test
    void oneSampledRunReproducesTheTransientTable() {
        // same values as opticalBlochTransient, from one run with samples at t = 1 and 2 (steps land on them)
        Evolution ev = Evolve.of(atom(1, 0.5, 1, 0)).over(0, 5).tolerance(TOL).density(GROUND).sampleAt(1, 2).run();
        assertTrue(ev.status().isSuccess(), () -> ev.status().toString());
        Timeline tr = ev.timeline();
        double[][] table = {{1, 0.1406423163699099, 0.082392014145719433, -0.3315835562121646},
                {2, 0.28186689768765842, 0.192940481530519, -0.3583900322055541},
                {5, 0.25118781368886936, 0.24450753083506668, -0.23899412144258958}};
        for (double[] row : table) {
            int k = Arrays.binarySearch(tr.times(), row[0]);
            assertTrue(k >= 0, "no sample at t = " + row[0] + " in " + Arrays.toString(tr.times()));
            Operator rho = tr.density(k);
            assertEquals(row[1], rho.re(0, 0), 1e-10, "t = " + row[0]);
            assertEquals(row[2], rho.re(0, 1), 1e-10, "t = " + row[0]);
            assertEquals(row[3], rho.im(0, 1), 1e-10, "t = " + row[0]);
        }
        assertEquals(0, Exact.maxDiff(tr.density(tr.size() - 1), ev.density()), 0.0, "last sample is the result");
    }

    @ParameterizedTest(name = "t = {0}")
    @CsvSource({"5, 0.1636135534237858, 0.3613093381975289, -0.04635845671559975",
            "10, 0.4964405482516496, 0.2434644895550065, 0.3764396965771534"})
    void drivenLabFrameTransientWithoutRotatingWaveApproximation(double t, double ee, double egRe, double egIm) {
        // H = (ω0/2)σz + Ω cos(ωt)σx, ω0 = 1, Ω = 0.2, ω = 1, decay Γ = 0.1, ρ(0) = |g⟩⟨g|
        // computed independently with mpmath.odefun (25 digits; DOP853 agrees to 1e-13)
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, ReferenceProblems.Z)
                .term(ReferenceProblems.X, Drive.cosine(0.2, 1)).build();
        Lindbladian l = Lindbladian.builder(h).jump(0.1, SIGMA_MINUS).build();
        Operator rho = evolve(l, GROUND, 0, t);
        assertEquals(ee, rho.re(0, 0), 1e-9);
        assertEquals(egRe, rho.re(0, 1), 1e-9);
        assertEquals(egIm, rho.im(0, 1), 1e-9);
    }

    @Test
    void amplitudeDampingChannelMatchesItsKrausForm() {
        // E0 = [[1,0],[0,√(1−γ)]], E1 = [[0,√γ],[0,0]] with |0⟩ = ground, γ = 1 − e^{−Γt} (M. A. Nielsen,
        // I. L. Chuang, Quantum Computation and Quantum Information (CUP 2000) §8.3.5); Γ = 1, t = 1.5; in our basis
        // |e⟩ = index 0, so the worked example reads with indices swapped: output ρ_gg = 0.84380888789609912.
        Hamiltonian zero = Hamiltonian.builder(2).term(0.0, ReferenceProblems.Z).build();
        Lindbladian l = Lindbladian.builder(zero).jump(1, SIGMA_MINUS).build();
        Evolution ev = Evolve.of(l).over(0, 1.5).tolerance(TOL).run();
        assertTrue(ev.status().isSuccess(), () -> ev.status().toString());
        // input in the book's basis (ground first) [[0.3, 0.2−0.1i],[0.2+0.1i, 0.7]] → ours (excited first)
        Operator in = Operator.of(new double[][]{{0.7, 0.2}, {0.2, 0.3}}, new double[][]{{0, 0.1}, {-0.1, 0}});
        Operator out = ev.channel().apply(in);
        assertEquals(0.84380888789609912, out.re(1, 1), 1e-10);
        assertEquals(0.15619111210390088, out.re(0, 0), 1e-10);
        // book (ground row, excited column) = 0.0944733105482029414 − 0.0472366552741014707 i = our (1, 0)
        assertEquals(0.0944733105482029414, out.re(1, 0), 1e-10);
        assertEquals(-0.0472366552741014707, out.im(1, 0), 1e-10);
    }

    /** Choi matrix J = Σ_ij |i⟩⟨j| ⊗ E(|i⟩⟨j|), built here from the map's action (M.-D. Choi, Linear Algebra Appl. 10, 285 (1975)). */
    static Operator choi(Superoperator e) {
        int n = e.dim(), nn = n * n;
        double[] re = new double[nn * nn], im = new double[nn * nn];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                Operator out = e.apply(Operator.unit(n, i, j));
                for (int a = 0; a < n; a++) {
                    for (int b = 0; b < n; b++) {
                        int row = i * n + a, col = j * n + b;
                        re[row * nn + col] = out.re(a, b);
                        im[row * nn + col] = out.im(a, b);
                    }
                }
            }
        }
        return Operator.ofPlanar(nn, re, im);
    }

    /**
     * Smallest eigenvalue of a Hermitian matrix A + iB via Commons Math's real symmetric eigensolver on the embedding
     * [[A, −B], [B, A]], whose spectrum is that of A + iB with every eigenvalue doubled (common practice).
     */
    static double minEigenvalue(Operator h) {
        int n = h.dim();
        double[][] m = new double[2 * n][2 * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double a = 0.5 * (h.re(i, j) + h.re(j, i)), b = 0.5 * (h.im(i, j) - h.im(j, i));
                m[i][j] = a;
                m[n + i][n + j] = a;
                m[i][n + j] = -b;
                m[n + i][j] = b;
            }
        }
        double[] ev = new EigenDecomposition(new Array2DRowRealMatrix(m)).getRealEigenvalues();
        return Arrays.stream(ev).min().orElseThrow();
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void computedChannelsPreserveTraceAndArePositive(long seed) {
        Random r = new Random(seed);
        int n = 2 + r.nextInt(2);
        Hamiltonian.Builder hb = Hamiltonian.builder(n).term(1.0, Seeds.randomHermitian(r, n));
        hb.term(Seeds.randomHermitian(r, n), Drive.cosine(0.5 + r.nextDouble(), 0.5 + 2 * r.nextDouble()));
        Lindbladian.Builder lb = Lindbladian.builder(hb.build());
        for (int k = 0; k < 2; k++) {
            lb.jump(0.05 + 0.5 * r.nextDouble(), Seeds.randomMatrix(r, n).scale(0.5));
        }
        Evolution ev = Evolve.of(lb.build()).over(0, 1 + 2 * r.nextDouble()).tolerance(1e-10).run();
        assertTrue(ev.status().isSuccess(), () -> ev.status().toString());
        Superoperator e = ev.channel();
        // trace preservation: tr E(ρ) = tr ρ for a random density matrix (and for every matrix unit)
        Operator a = Seeds.randomMatrix(r, n);
        Operator rho = a.times(a.dagger());
        rho = rho.scale(1 / rho.trace().getReal());
        Complex tr = e.apply(rho).trace();
        assertTrue(Math.abs(tr.getReal() - 1) <= 1e-13 && Math.abs(tr.getImaginary()) <= 1e-13, "seed " + seed + ": tr = " + tr);
        // complete positivity: the Choi matrix is positive semidefinite (M.-D. Choi 1975); a GKLS semigroup is
        // completely positive (G. Lindblad, Commun. Math. Phys. 48, 119 (1976)), so only rounding/truncation remains
        double lmin = minEigenvalue(choi(e));
        assertTrue(lmin >= -1e-12, "seed " + seed + ": smallest Choi eigenvalue " + lmin);
    }
}
