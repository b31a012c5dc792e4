package org.liepath.core;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import java.util.Arrays;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Reference checks of GKLS generators, Choi matrices and Kraus channels against closed forms and published worked
 * values. Convention (GKLS): dρ/dt = −i[H,ρ] + Σ_k γ_k (L_k ρ L_k† − ½{L_k†L_k, ρ}).
 *
 * <p>Tolerances: the generators here have norms O(1) and their exponentials are computed by Padé scaling and squaring
 * with backward error near 1e-16·‖tS‖; with ‖tS‖ ≲ 10 a forward error of 1e-13 is ample, 1e-12 where the reference
 * values are given to 15–16 digits only.
 */
class GklsReferenceTest {
    private static final Operator SIGMA_MINUS_EG = Operator.unit(2, 1, 0); // |g⟩⟨e| with |e⟩ = index 0

    private static Operator rho(double r00, double r01re, double r01im, double r11) {
        return Operator.of(new double[][]{{r00, r01re}, {r01re, r11}}, new double[][]{{0, r01im}, {-r01im, 0}});
    }

    private static void close(Operator expected, Operator actual, double tol, String what) {
        assertTrue(expected.distance(actual) <= tol,
                () -> what + ": distance " + expected.distance(actual) + "\nexpected " + expected + "\nactual " + actual);
    }

    private static Hamiltonian zeroH(int n) {
        return Hamiltonian.constant(Operator.zero(n));
    }

    // ------------------------------------------------------------------ free decay, closed forms

    @Test
    void amplitudeDampingFollowsTheT1ClosedForm() {
        // |0⟩ ground, |1⟩ excited, L = √Γ |0⟩⟨1|, H = 0: ρ11(t) = e^{−Γt}ρ11(0), ρ01(t) = e^{−Γt/2}ρ01(0),
        // ρ00 = 1 − ρ11 (F. Bloch, Phys. Rev. 70 (1946) 460 [M]; Nielsen & Chuang 2000, §8.3.5 [M])
        double gamma = 0.7;
        Lindbladian l = Lindbladian.builder(zeroH(2)).jump(gamma, Operator.unit(2, 0, 1)).build();
        Superoperator s = l.at(0);
        Operator rho0 = rho(0.3, 0.2, -0.1, 0.7);
        for (double t : new double[]{0, 0.1, 1, 2.5, 8}) {
            Operator r = s.exp(t).apply(rho0);
            double e = Math.exp(-gamma * t), h = Math.exp(-gamma * t / 2);
            close(rho(1 - 0.7 * e, 0.2 * h, -0.1 * h, 0.7 * e), r, 1e-14, "t = " + t);
        }
    }

    @Test
    void pureDephasingFollowsTheT2ClosedForm() {
        // L = σz with rate γ: populations fixed, coherence × e^{−2γt} (Breuer & Petruccione 2002, §3.4 [M])
        double g = 0.35;
        Lindbladian l = Lindbladian.builder(zeroH(2)).jump(g, Pauli.z()).build();
        Operator rho0 = rho(0.4, 0.3, 0.2, 0.6);
        for (double t : new double[]{0.2, 1, 3}) {
            double c = Math.exp(-2 * g * t);
            close(rho(0.4, 0.3 * c, 0.2 * c, 0.6), l.at(0).exp(t).apply(rho0), 1e-14, "t = " + t);
        }
    }

    @Test
    void decayAndDephasingGiveTheWorkedT1T2Numbers() {
        // computed independently (mpmath) from the T1/T2 closed forms of Bloch 1946: Γ = 1, γφ = 0.3 with L_φ = √(γφ/2)σz, t = 1.5, ρ(0) = |+⟩⟨+|:
        // ρ_ee = ½e^{−1.5} = 0.111565080074214914, ρ_eg = ½e^{−(Γ/2+γφ)t} = ½e^{−1.2} = 0.150597105956101048
        Lindbladian l = Lindbladian.builder(zeroH(2)).jump(1.0, SIGMA_MINUS_EG).jump(0.15, Pauli.z()).build();
        Operator plus = StateVector.real(1, 1).normalized().toDensity();
        Operator r = l.at(0).exp(1.5).apply(plus);
        assertEquals(0.111565080074214914, r.re(0, 0), 1e-15);
        assertEquals(0.150597105956101048, r.re(0, 1), 1e-15);
        assertEquals(0.0, r.im(0, 1), 1e-15);
    }

    // ------------------------------------------------------------------ amplitude-damping channel

    private static List<Operator> amplitudeDampingKraus(double g) {
        // Nielsen & Chuang, Quantum Computation and Quantum Information, CUP 2000, eq. (8.108) [M for the number]
        return List.of(Operator.diagonal(1, Math.sqrt(1 - g)), Operator.unit(2, 0, 1).scale(Math.sqrt(g)));
    }

    @Test
    void krausFormEqualsTheGklsEvolutionOnTheWorkedExample() {
        // worked example computed independently (mpmath, 40 digits): Γ = 1, t = 1.5 ⇒ γ = 1 − e^{−1.5} = 0.776869839851570171;
        // ρ = [[0.3, 0.2−0.1i],[0.2+0.1i, 0.7]] ↦ [[0.84380888789609912, 0.0944733105482029414 − 0.0472366552741014707i],
        // [c.c., 0.15619111210390088]] (Kraus and Lindblad agree to 40 digits there)
        double g = 1 - Math.exp(-1.5);
        assertEquals(0.776869839851570171, g, 1e-16);
        Operator in = rho(0.3, 0.2, -0.1, 0.7);
        Operator expected = rho(0.84380888789609912, 0.0944733105482029414, -0.0472366552741014707, 0.15619111210390088);
        Superoperator kraus = Superoperator.kraus(amplitudeDampingKraus(g));
        close(expected, kraus.apply(in), 1e-15, "Kraus channel");
        Superoperator gen = Lindbladian.builder(zeroH(2)).jump(1.0, Operator.unit(2, 0, 1)).build().at(0);
        close(expected, gen.exp(1.5).apply(in), 1e-14, "exp(1.5 S)");
        assertTrue(kraus.distance(gen.exp(1.5)) <= 1e-14, "the maps agree as matrices");
        // and Σ K ρ K† by hand
        Operator byHand = Operator.zero(2);
        for (Operator k : amplitudeDampingKraus(g)) {
            byHand = byHand.plus(k.times(in).times(k.dagger()));
        }
        close(byHand, kraus.apply(in), 1e-15, "Σ K ρ K†");
    }

    @Test
    void choiMatrixOfAmplitudeDampingHasTheKnownSpectrumAndMarginals() {
        // J = v0v0† + v1v1† with v0 = (1, 0, 0, √(1−γ)), v1 = (0, 0, √γ, 0), orthogonal: eigenvalues 2 − γ, γ, 0, 0
        // (M.-D. Choi, Linear Algebra Appl. 10 (1975) 285 for J; values derived from eq. (8.108) of Nielsen & Chuang).
        // Trace preservation ⇔ tr_out J = I; tr_in J = E(I) = diag(1 + γ, 1 − γ).
        double g = 0.3;
        Operator j = Superoperator.kraus(amplitudeDampingKraus(g)).choi();
        assertTrue(j.isHermitian(1e-15));
        double[] ev = realEmbeddingEigenvalues(j);
        double[] expect = {0, 0, 0, 0, g, g, 2 - g, 2 - g}; // each eigenvalue twice in the real embedding
        for (int k = 0; k < 8; k++) {
            assertEquals(expect[k], ev[k], 1e-14, "eigenvalue " + k);
        }
        HilbertSpace inOut = HilbertSpace.of(2, 2);
        close(Operator.identity(2), inOut.partialTrace(j, 1), 1e-15, "tr_out J");
        close(Operator.diagonal(1 + g, 1 - g), inOut.partialTrace(j, 0), 1e-15, "tr_in J");
        // the generator's exponential gives the same Choi matrix (γ = 1 − e^{−Γt})
        Superoperator gen = Lindbladian.builder(zeroH(2)).jump(2.0, Operator.unit(2, 0, 1)).build().at(0);
        double t = -Math.log(1 - g) / 2.0;
        close(j, gen.exp(t).choi(), 1e-14, "Choi of exp(tS)");
    }

    /** Eigenvalues (ascending) of a Hermitian H = A + iB from the real symmetric [[A, −B],[B, A]] (Commons Math). */
    static double[] realEmbeddingEigenvalues(Operator h) {
        int n = h.dim();
        double[][] m = new double[2 * n][2 * n];
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < n; k++) {
                // symmetrise to remove the rounding-level anti-Hermitian part Commons Math would refuse
                double a = 0.5 * (h.re(i, k) + h.re(k, i)), b = 0.5 * (h.im(i, k) - h.im(k, i));
                m[i][k] = a;
                m[n + i][n + k] = a;
                m[i][n + k] = -b;
                m[n + i][k] = b;
            }
        }
        double[] ev = new EigenDecomposition(new Array2DRowRealMatrix(m, false)).getRealEigenvalues();
        Arrays.sort(ev);
        return ev;
    }

    @Test
    void choiMatrixDeterminesTheMap() {
        // Choi–Jamiołkowski: the map ↔ J correspondence is a bijection (Choi 1975); ofChoi inverts choi exactly
        java.util.Random r = new java.util.Random(21);
        for (int n = 1; n <= 4; n++) {
            Superoperator s = Superoperator.ofMatrix(org.liepath.testing.Seeds.randomMatrix(r, n * n));
            assertEquals(s, Superoperator.ofChoi(s.choi()));
            assertEquals(s.hashCode(), Superoperator.ofChoi(s.choi()).hashCode());
        }
        // the identity channel's Choi matrix is the unnormalised projector onto Σ|aa⟩ (entries 1 at (aa, bb))
        Operator j = Superoperator.identity(2).choi();
        Operator omega = StateVector.real(1, 0, 0, 1).toDensity();
        assertEquals(omega, j);
        assertEquals(Superoperator.identity(2), Superoperator.ofChoi(omega));
        assertTrue(!Superoperator.identity(2).equals(Superoperator.identity(2).scale(2)));
    }

    @Test
    void krausOperatorsRoundTripThroughTheChoiMatrix() {
        double g = 0.45;
        Superoperator ch = Superoperator.kraus(amplitudeDampingKraus(g));
        List<Operator> ks = ch.krausOperators();
        assertEquals(2, ks.size(), "rank of the Choi matrix");
        assertTrue(Superoperator.kraus(ks).distance(ch) <= 1e-14);
        // Σ K†K = I (trace preservation)
        Operator sum = Operator.zero(2);
        for (Operator k : ks) {
            sum = sum.plus(k.dagger().times(k));
        }
        close(Operator.identity(2), sum, 1e-14, "Σ K†K");
        // a unitary channel has a single Kraus operator, equal to U up to a phase
        Operator u = Pauli.string("Y").expMinusI(0.8);
        List<Operator> ku = Superoperator.unitary(u).krausOperators();
        assertEquals(1, ku.size());
        org.apache.commons.math3.complex.Complex phase = u.inner(ku.get(0)).divide(2);
        assertEquals(1.0, phase.abs(), 1e-14);
        close(u.scale(phase), ku.get(0), 1e-14, "K = e^{iφ}U");
    }

    // ------------------------------------------------------------------ optical Bloch equations

    @ParameterizedTest(name = "Ω={0} Δ={1} Γ={2} γφ={3}")
    @CsvSource({
            "1, 0, 1, 0, 0.333333333333333333, 0, -0.333333333333333333",
            "2, 0.5, 1, 0, 0.4, 0.2, -0.2",
            "0.3, 1, 0.2, 0, 0.0213270142180094787, 0.14218009478673, -0.014218009478673",
            "1, 0.5, 1, 0.3, 0.236686390532544379, 0.14792899408284, -0.236686390532544"})
    void opticalBlochSteadyStateMatchesTheTable(double omega, double delta, double gamma, double gphi,
                                                double ree, double regRe, double regIm) {
        // ρ_ee = (Ω²/4)/(Δ² + Ω²/2 + Γ²/4) (Foot, Atomic Physics, OUP 2005, §7.3 [M]); with dephasing
        // (γ2 = Γ/2 + γφ) ρ_ee = ½(Ω²γ2/Γ)/(γ2² + Δ² + Ω²γ2/Γ). Rotating frame H = −(Δ/2)σz + (Ω/2)σx, |e⟩ = index 0,
        // L = √Γσ−, L_φ = √(γφ/2)σz (also Allen & Eberly, Optical Resonance and Two-Level Atoms, Wiley 1975 [M]).
        // Table values computed independently (mpmath null vector of the Liouvillian, 40 digits); the ρ_eg values
        // are quoted to 14 digits, hence 1e-12.
        Hamiltonian h = Hamiltonian.builder(2).term(-delta / 2, Pauli.z()).term(omega / 2, Pauli.x()).build();
        Lindbladian.Builder b = Lindbladian.builder(h).jump(gamma, SIGMA_MINUS_EG);
        if (gphi > 0) {
            b.jump(gphi / 2, Pauli.z());
        }
        Lindbladian l = b.build();
        Operator ss = l.steadyState();
        assertEquals(ree, ss.re(0, 0), 1e-12, "ρ_ee");
        assertEquals(regRe, ss.re(0, 1), 1e-12, "Re ρ_eg");
        assertEquals(regIm, ss.im(0, 1), 1e-12, "Im ρ_eg");
        assertEquals(1.0, ss.trace().getReal(), 1e-14);
        // the formula itself, recomputed here
        double g2 = gamma / 2 + gphi;
        double formula = 0.5 * (omega * omega * g2 / gamma) / (g2 * g2 + delta * delta + omega * omega * g2 / gamma);
        assertEquals(formula, ss.re(0, 0), 1e-14, "closed form");
        // L(ρ_ss) = 0
        assertTrue(l.at(0).apply(ss).norm() <= 1e-14);
        // independently: the null vector of the 4×4 Liouvillian from Commons Math's SVD of its real 8×8 embedding
        close(nullStateBySvd(l.at(0)), ss, 1e-13, "Commons Math null vector");
    }

    /**
     * The trace-one null vector of a generator from the right singular vector of the smallest singular value of the
     * real embedding [[A, −B],[B, A]] of S = A + iB (Commons Math SingularValueDecomposition): a real null vector
     * (x; y) gives the complex null vector x + iy.
     */
    static Operator nullStateBySvd(Superoperator s) {
        Operator m = s.matrix();
        int nn = m.dim(), n = s.dim();
        double[][] e = new double[2 * nn][2 * nn];
        for (int i = 0; i < nn; i++) {
            for (int k = 0; k < nn; k++) {
                e[i][k] = m.re(i, k);
                e[nn + i][nn + k] = m.re(i, k);
                e[i][nn + k] = -m.im(i, k);
                e[nn + i][k] = m.im(i, k);
            }
        }
        org.apache.commons.math3.linear.SingularValueDecomposition svd =
                new org.apache.commons.math3.linear.SingularValueDecomposition(new Array2DRowRealMatrix(e, false));
        double[] sv = svd.getSingularValues(); // descending
        assertTrue(sv[2 * nn - 1] <= 1e-13 * sv[0] && sv[2 * nn - 3] > 1e-8 * sv[0], "a two-dimensional real kernel");
        double[] v = svd.getV().getColumn(2 * nn - 1);
        double[][] re = new double[n][n], im = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                re[i][j] = v[i + n * j];
                im[i][j] = v[nn + i + n * j];
            }
        }
        Operator rho = Operator.of(re, im);
        return rho.scale(rho.trace().reciprocal());
    }

    @ParameterizedTest(name = "t = {0}")
    @CsvSource({
            "1, 0.1406423163699099, 0.082392014145719433, -0.3315835562121646",
            "2, 0.28186689768765842, 0.192940481530519, -0.3583900322055541",
            "5, 0.25118781368886936, 0.24450753083506668, -0.23899412144258958"})
    void opticalBlochTransientMatchesTheTable(double t, double ree, double regRe, double regIm) {
        // computed independently (mpmath expm of the Liouvillian; an explicit Runge–Kutta DOP853 run agrees to 1e-13): Ω = 1, Δ = 0.5, Γ = 1,
        // ρ(0) = |g⟩⟨g|
        Hamiltonian h = Hamiltonian.builder(2).term(-0.25, Pauli.z()).term(0.5, Pauli.x()).build();
        Lindbladian l = Lindbladian.builder(h).jump(1.0, SIGMA_MINUS_EG).build();
        Operator r = l.at(0).exp(t).apply(Operator.unit(2, 1, 1));
        assertEquals(ree, r.re(0, 0), 1e-13);
        assertEquals(regRe, r.re(0, 1), 1e-13);
        assertEquals(regIm, r.im(0, 1), 1e-13);
        assertEquals(1.0, r.trace().getReal(), 1e-14);
    }

    @Test
    void longTimeLimitOfTheTransientIsTheSteadyState() {
        // t → ∞ gives ρ_ee = 0.25, ρ_eg = 0.25 − 0.25i (the steady-state formula above, Foot 2005 §7.3 [M])
        Hamiltonian h = Hamiltonian.builder(2).term(-0.25, Pauli.z()).term(0.5, Pauli.x()).build();
        Lindbladian l = Lindbladian.builder(h).jump(1.0, SIGMA_MINUS_EG).build();
        Operator late = l.at(0).exp(80).apply(Operator.unit(2, 1, 1));
        Operator ss = l.steadyState();
        close(ss, late, 1e-12, "ρ(80) vs steady state");
        assertEquals(0.25, ss.re(0, 0), 1e-14);
        assertEquals(0.25, ss.re(0, 1), 1e-14);
        assertEquals(-0.25, ss.im(0, 1), 1e-14);
    }

    // ------------------------------------------------------------------ structure of the generator

    @Test
    void generatorIsTraceAnnihilatingAndHermiticityPreserving() {
        Hamiltonian h = Hamiltonian.builder(3).term(0.7, Levels.gellMann(3).get(0)).term(-0.2, Levels.gellMann(3).get(7))
                .build();
        Lindbladian l = Lindbladian.builder(h).jump(0.4, Levels.annihilation(3)).jump(0.1, Levels.gellMann(3).get(3))
                .build();
        Superoperator s = l.at(0);
        assertTrue(s.generatorTraceDefect() <= 1e-14 * s.matrix().norm());
        Operator herm = org.liepath.testing.Seeds.randomHermitian(new java.util.Random(5), 3);
        assertTrue(s.apply(herm).isHermitian(1e-14));
        // a Hamiltonian-only generator is −i(I⊗H − Hᵀ⊗I), and its exponential is the unitary channel of e^{−iHt}
        Operator hh = h.at(0);
        Superoperator unitaryGen = Lindbladian.builder(h).build().at(0);
        assertTrue(unitaryGen.exp(0.9).distance(Superoperator.unitary(hh.expMinusI(0.9))) <= 1e-13);
        // dissipator() is the generator of H = 0
        assertTrue(l.dissipator().distance(Lindbladian.builder(Hamiltonian.constant(Operator.zero(3)))
                .jump(0.4, Levels.annihilation(3)).jump(0.1, Levels.gellMann(3).get(3)).build().at(0)) <= 0);
    }

    @Test
    void superoperatorAlgebraMatchesMapComposition() {
        java.util.Random r = new java.util.Random(8);
        Operator a = org.liepath.testing.Seeds.randomMatrix(r, 3), b = org.liepath.testing.Seeds.randomMatrix(r, 3);
        Operator c = org.liepath.testing.Seeds.randomMatrix(r, 3), d = org.liepath.testing.Seeds.randomMatrix(r, 3);
        Operator x = org.liepath.testing.Seeds.randomMatrix(r, 3);
        Superoperator first = Superoperator.sandwich(a, b), second = Superoperator.sandwich(c, d);
        double tol = 1e-13 * a.norm() * b.norm() * c.norm() * d.norm() * x.norm();
        // compose: other acts first
        close(c.times(a).times(x).times(b).times(d), second.compose(first).apply(x), tol, "compose");
        close(a.times(x).times(b).plus(x.scale(2)), first.plus(Superoperator.identity(3).scale(2)).apply(x),
                1e-13 * a.norm() * b.norm() * x.norm(), "plus, scale");
        assertEquals(3, first.dim());
        assertEquals(9, first.matrix().dim());
        assertTrue(first.toString().startsWith("Superoperator on 3x3 operators\nOperator 9x9"), first.toString());
        // exp(tS) of a generator is a semigroup: e^{sS}e^{tS} = e^{(s+t)S}
        Superoperator gen = Lindbladian.builder(Hamiltonian.constant(Pauli.x().scale(0.4)))
                .jump(0.5, Operator.unit(2, 0, 1)).build().at(0);
        assertTrue(gen.exp(0.3).compose(gen.exp(0.9)).distance(gen.exp(1.2)) <= 1e-14);
        assertTrue(gen.exp().distance(gen.exp(1.0)) <= 0);
    }

    @Test
    void timeDependentGeneratorIsTheHamiltonianPartPlusTheDissipator() {
        Drive pulse = Drive.gaussian(0.8, 1, 0.3);
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), pulse).build();
        Lindbladian l = Lindbladian.builder(h).jump(0.2, Operator.unit(2, 0, 1)).jump(0.05, Pauli.z()).build();
        assertTrue(!l.isTimeIndependent());
        assertEquals(2, l.dim());
        assertEquals(List.of(0.2, 0.05), l.rates());
        assertEquals(List.of(Operator.unit(2, 0, 1), Pauli.z()), l.jumps());
        assertTrue(l.hamiltonian() == h);
        assertEquals("Lindbladian (dimension 2, 2 Hamiltonian terms, 2 jumps)", l.toString());
        for (double t : new double[]{0, 0.7, 1.0, 2.2}) {
            Operator ht = h.at(t);
            Superoperator expect = Superoperator.ofMatrix(Lindbladian.hamiltonianPart(ht).plus(l.dissipator().matrix()));
            assertTrue(expect.distance(l.at(t)) <= 0, "t = " + t);
            // ρ ↦ −i[H(t), ρ] through the Hamiltonian part
            Operator rho = rho(0.6, 0.1, 0.2, 0.4);
            close(ht.commutator(rho).timesI().scale(-1), Superoperator.ofMatrix(Lindbladian.hamiltonianPart(ht)).apply(rho),
                    1e-15, "−i[H, ρ]");
        }
    }

    @Test
    void traceDefectOfAChannelAndOfAGeneratorAreZero() {
        Superoperator gen = Lindbladian.builder(zeroH(2)).jump(1.0, Operator.unit(2, 0, 1)).build().at(0);
        assertTrue(gen.exp(0.6).traceDefect() <= 1e-15);
        assertEquals(0.0, gen.generatorTraceDefect(), 1e-16);
        // a non-trace-preserving map is seen: ρ ↦ ½ρ has defect ½
        assertEquals(0.5, Superoperator.identity(2).scale(0.5).traceDefect(), 1e-16);
    }
}
