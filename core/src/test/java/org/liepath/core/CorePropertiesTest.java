package org.liepath.core;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.testing.Seeds;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Algebraic properties over seeded random cases (org.liepath.testing.Seeds; a failure prints the seed).
 *
 * <p>Tolerances: random matrices have standard normal entries, so ‖A‖_F ≈ n; a product of k factors carries a
 * rounding error of order k·n·ε·Π‖·‖ (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed. 2002, §3.5).
 * Each check uses 1e-13 times the product of the norms involved (≈ 500 ε), far above rounding and far below any
 * genuine error (which would be O(‖·‖)).
 */
class CorePropertiesTest {
    private static final String CASES = "org.liepath.testing.Seeds#cases";

    private static int dim(Random r) {
        return 1 + r.nextInt(5);
    }

    private static void close(Operator expected, Operator actual, double tol, String what) {
        assertTrue(expected.distance(actual) <= tol, () -> what + ": distance " + expected.distance(actual) + " > " + tol);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource(CASES)
    void kroneckerMixedProductRule(long seed) {
        // (A⊗B)(C⊗D) = AC ⊗ BD (Horn & Johnson, Topics in Matrix Analysis, CUP 1991, Lemma 4.2.10)
        Random r = new Random(seed);
        int n = dim(r), m = dim(r);
        Operator a = Seeds.randomMatrix(r, n), c = Seeds.randomMatrix(r, n);
        Operator b = Seeds.randomMatrix(r, m), d = Seeds.randomMatrix(r, m);
        double scale = a.norm() * b.norm() * c.norm() * d.norm();
        close(a.times(c).kron(b.times(d)), a.kron(b).times(c.kron(d)), 1e-13 * scale, "mixed product");
        // (A⊗B)† = A†⊗B†, tr(A⊗B) = trA·trB
        assertEquals(a.dagger().kron(b.dagger()), a.kron(b).dagger());
        assertTrue(a.kron(b).trace().subtract(a.trace().multiply(b.trace())).abs() <= 1e-13 * a.norm() * b.norm() * n * m);
        // partial traces undo the product: tr_1(A⊗B) = A·trB, tr_0(A⊗B) = trA·B
        HilbertSpace hs = HilbertSpace.of(n, m);
        close(a.scale(b.trace()), hs.partialTrace(a.kron(b), 1), 1e-13 * a.norm() * b.norm() * m, "tr_1");
        close(b.scale(a.trace()), hs.partialTrace(a.kron(b), 0), 1e-13 * a.norm() * b.norm() * n, "tr_0");
        // vec(AXB) = (Bᵀ⊗A) vec(X) through sandwich
        Operator x = Seeds.randomMatrix(r, n);
        close(a.times(x).times(c), Superoperator.sandwich(a, c).apply(x), 1e-13 * a.norm() * x.norm() * c.norm(), "AXB");
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource(CASES)
    void daggerIsAnAntiAutomorphism(long seed) {
        // (AB)† = B†A†, (A + B)† = A† + B†, (zA)† = z̄A†, A†† = A (common practice)
        Random r = new Random(seed);
        int n = dim(r);
        Operator a = Seeds.randomMatrix(r, n), b = Seeds.randomMatrix(r, n);
        Complex z = new Complex(r.nextGaussian(), r.nextGaussian());
        double tol = 1e-13 * a.norm() * b.norm();
        close(b.dagger().times(a.dagger()), a.times(b).dagger(), tol, "(AB)†");
        assertEquals(a.dagger().plus(b.dagger()), a.plus(b).dagger());
        close(a.dagger().scale(z.conjugate()), a.scale(z).dagger(), 1e-14 * a.norm() * z.abs(), "(zA)†");
        assertEquals(a, a.dagger().dagger());
        assertEquals(a.transpose().conjugate(), a.dagger());
        // ⟨A, B⟩ = tr(A†B) and conjugate symmetry
        assertTrue(a.inner(b).subtract(a.dagger().times(b).trace()).abs() <= tol * n);
        assertTrue(a.inner(b).subtract(b.inner(a).conjugate()).abs() <= tol);
        assertEquals(a.norm() * a.norm(), a.inner(a).getReal(), 1e-13 * a.norm() * a.norm());
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource(CASES)
    void commutatorIsAntisymmetricAndSatisfiesJacobi(long seed) {
        // [A,B] = −[B,A]; [A,[B,C]] + [B,[C,A]] + [C,[A,B]] = 0 (any Lie-algebra text, e.g. Hall, Lie Groups, Lie
        // Algebras, and Representations, 2nd ed. 2015, Def. 3.1)
        Random r = new Random(seed);
        int n = dim(r);
        Operator a = Seeds.randomMatrix(r, n), b = Seeds.randomMatrix(r, n), c = Seeds.randomMatrix(r, n);
        assertEquals(a.commutator(b).scale(-1), b.commutator(a), "exact antisymmetry (same products, swapped)");
        Operator jacobi = a.commutator(b.commutator(c)).plus(b.commutator(c.commutator(a))).plus(c.commutator(a.commutator(b)));
        assertTrue(jacobi.norm() <= 1e-13 * a.norm() * b.norm() * c.norm(), () -> "Jacobi residual " + jacobi.norm());
        // {A,B} − [A,B] = 2BA, and the commutator of Hermitian matrices is anti-Hermitian
        close(b.times(a).scale(2), a.anticommutator(b).minus(a.commutator(b)), 1e-13 * a.norm() * b.norm(), "{,} − [,]");
        Operator h1 = Seeds.randomHermitian(r, n), h2 = Seeds.randomHermitian(r, n);
        assertTrue(h1.commutator(h2).timesI().isHermitian(1e-14));
        // A^k by squaring equals repeated products
        int k = r.nextInt(6);
        Operator p = Operator.identity(n);
        for (int q = 0; q < k; q++) {
            p = p.times(a);
        }
        close(p, a.power(k), 1e-13 * Math.pow(a.norm(), k) * k, "A^" + k);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource(CASES)
    void hamiltonianAtEqualsTheExplicitSum(long seed) {
        Random r = new Random(seed);
        int n = dim(r), terms = 1 + r.nextInt(4);
        Hamiltonian.Builder b = Hamiltonian.builder(n);
        List<Operator> ops = new ArrayList<>();
        List<Drive> drives = new ArrayList<>();
        for (int k = 0; k < terms; k++) {
            Operator a = Seeds.randomHermitian(r, n);
            Drive d;
            switch (r.nextInt(4)) {
                case 0: d = Drive.constant(r.nextGaussian()); break;
                case 1: d = Drive.cosine(r.nextGaussian(), 3 * r.nextDouble(), r.nextDouble()); break;
                case 2: d = Drive.gaussian(r.nextGaussian(), r.nextDouble(), 0.1 + r.nextDouble()); break;
                default: d = Drive.samples(0, 0.25, r.nextGaussian(), r.nextGaussian(), r.nextGaussian()); break;
            }
            ops.add(a);
            drives.add(d);
            b.term(a, d);
        }
        Hamiltonian h = b.build();
        double t = 2 * r.nextDouble() - 0.5;
        Operator sum = Operator.zero(n);
        double[] c = new double[terms];
        h.coefficients(t, c);
        for (int k = 0; k < terms; k++) {
            sum = sum.plus(ops.get(k).scale(drives.get(k).at(t)));
            assertEquals(drives.get(k).at(t), c[k], 0.0, "coefficient " + k);
        }
        Operator ht = h.at(t);
        close(sum, ht, 1e-14 * (sum.norm() + 1) * terms, "H(t)");
        assertTrue(ht.isHermitian(1e-14));
        assertEquals(ops, h.operators());
        assertEquals(drives, h.drives());
        // triangle inequality: Σ|c_k|‖A_k‖_F ≥ ‖H‖_F ≥ ‖H‖₂
        assertTrue(h.normBound(t) >= ht.norm() * (1 - 1e-14), "normBound ≥ ‖H(t)‖_F");
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource(CASES)
    void randomGklsGeneratorsPreserveTraceAndHermiticity(long seed) {
        // any GKLS generator annihilates the trace and maps Hermitian to Hermitian operators (G. Lindblad,
        // Commun. Math. Phys. 48 (1976) 119; Gorini, Kossakowski, Sudarshan, J. Math. Phys. 17 (1976) 821)
        Random r = new Random(seed);
        int n = 1 + r.nextInt(4);
        Lindbladian.Builder b = Lindbladian.builder(Hamiltonian.constant(Seeds.randomHermitian(r, n)));
        int jumps = r.nextInt(4);
        for (int k = 0; k < jumps; k++) {
            b.jump(r.nextDouble() * 2, Seeds.randomMatrix(r, n));
        }
        Superoperator s = b.build().at(0);
        double sn = s.matrix().norm();
        assertTrue(s.generatorTraceDefect() <= 1e-14 * sn, () -> "trace defect " + s.generatorTraceDefect());
        Operator rho = Seeds.randomHermitian(r, n);
        Operator out = s.apply(rho);
        assertTrue(out.hermitianDefect() <= 1e-14 * sn * rho.norm(), () -> "Hermiticity defect " + out.hermitianDefect());
        assertTrue(out.trace().abs() <= 1e-14 * sn * rho.norm() * n);
        // the map it generates is trace preserving
        Superoperator ch = s.exp(0.1 + r.nextDouble());
        assertTrue(ch.traceDefect() <= 1e-13 * Math.max(1, sn), () -> "channel trace defect " + ch.traceDefect());
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource(CASES)
    void randomCptpKrausChannelsHavePositiveChoiMatrices(long seed) {
        // random Kraus operators: the blocks of a random isometry V = [K_0; K_1; …] (Gram–Schmidt on its columns), so
        // Σ K†K = V†V = I up to rounding (Stinespring form, common practice). Choi's theorem (Choi 1975):
        // E is CP iff J ⪰ 0; eigenvalues of J are computed independently with Commons Math on the real embedding.
        Random r = new Random(seed);
        int n = 1 + r.nextInt(3), kcount = 1 + r.nextInt(3);
        List<Operator> ks = randomKraus(r, n, kcount);
        Operator sum = Operator.zero(n);
        for (Operator k : ks) {
            sum = sum.plus(k.dagger().times(k));
        }
        close(Operator.identity(n), sum, 1e-14 * n, "Σ K†K = I");
        Superoperator ch = Superoperator.kraus(ks);
        assertTrue(ch.traceDefect() <= 1e-14 * n);
        Operator j = ch.choi();
        double[] ev = GklsReferenceTest.realEmbeddingEigenvalues(j);
        assertTrue(ev[0] >= -1e-14 * n, () -> "min Choi eigenvalue " + ev[0]);
        double total = 0;
        for (double e : ev) {
            total += e;
        }
        assertEquals(2 * n, total, 1e-12, "tr J = n (each eigenvalue counted twice)");
        // the positive rank is at most the number of Kraus operators
        int positive = 0;
        for (double e : ev) {
            if (e > 1e-10) {
                positive++;
            }
        }
        assertTrue(positive <= 2 * kcount);
        // Choi → Kraus → superoperator round trip
        List<Operator> back = ch.krausOperators();
        assertTrue(back.size() <= kcount && back.size() == positive / 2, "number of Kraus operators = rank J");
        assertTrue(Superoperator.kraus(back).distance(ch) <= 1e-12, "round trip");
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void randomGklsSteadyStatesAreDensityMatricesInTheKernel(long seed) {
        // a generic GKLS generator (random H, two random jump operators) has a unique steady state, a density matrix
        // (H. Spohn, Rep. Math. Phys. 10 (1976) 189 [M]); its positivity is checked with Commons Math eigenvalues
        Random r = new Random(seed);
        int n = 2 + r.nextInt(3);
        Lindbladian l = Lindbladian.builder(Hamiltonian.constant(Seeds.randomHermitian(r, n)))
                .jump(0.2 + r.nextDouble(), Seeds.randomMatrix(r, n)).jump(0.2 + r.nextDouble(), Seeds.randomMatrix(r, n))
                .build();
        Superoperator s = l.at(0);
        Operator ss = l.steadyState();
        double sn = s.matrix().norm();
        assertTrue(s.apply(ss).norm() <= 1e-12 * sn, () -> "residual " + s.apply(ss).norm());
        assertEquals(1.0, ss.trace().getReal(), 1e-13);
        assertTrue(ss.isHermitian(0));
        double[] ev = GklsReferenceTest.realEmbeddingEigenvalues(ss);
        assertTrue(ev[0] >= -1e-12, () -> "min eigenvalue " + ev[0]);
        // the channel of the generator is CP: its Choi → Kraus → superoperator round trip closes
        Superoperator ch = s.exp(0.5);
        List<Operator> ks = ch.krausOperators();
        assertTrue(ks.size() <= n * n);
        assertTrue(Superoperator.kraus(ks).distance(ch) <= 1e-11 * ch.matrix().norm(), "Kraus round trip");
        // and the steady state is a fixed point of the channel
        assertTrue(ch.apply(ss).distance(ss) <= 1e-12 * sn);
    }

    static List<Operator> randomKraus(Random r, int n, int count) {
        int rows = n * count;
        double[][] vr = new double[rows][n], vi = new double[rows][n];
        for (int c = 0; c < n; c++) {
            for (int i = 0; i < rows; i++) {
                vr[i][c] = r.nextGaussian();
                vi[i][c] = r.nextGaussian();
            }
            for (int p = 0; p < c; p++) { // modified Gram–Schmidt against the earlier columns
                double dr = 0, di = 0;
                for (int i = 0; i < rows; i++) { // ⟨col p, col c⟩
                    dr += vr[i][p] * vr[i][c] + vi[i][p] * vi[i][c];
                    di += vr[i][p] * vi[i][c] - vi[i][p] * vr[i][c];
                }
                for (int i = 0; i < rows; i++) {
                    vr[i][c] -= dr * vr[i][p] - di * vi[i][p];
                    vi[i][c] -= dr * vi[i][p] + di * vr[i][p];
                }
            }
            double nrm = 0;
            for (int i = 0; i < rows; i++) {
                nrm += vr[i][c] * vr[i][c] + vi[i][c] * vi[i][c];
            }
            nrm = Math.sqrt(nrm);
            for (int i = 0; i < rows; i++) {
                vr[i][c] /= nrm;
                vi[i][c] /= nrm;
            }
        }
        List<Operator> ks = new ArrayList<>();
        for (int k = 0; k < count; k++) {
            double[][] kr = new double[n][], ki = new double[n][];
            for (int i = 0; i < n; i++) {
                kr[i] = vr[k * n + i].clone();
                ki[i] = vi[k * n + i].clone();
            }
            ks.add(Operator.of(kr, ki));
        }
        return ks;
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void operationsNeverModifyTheirInputs(long seed) {
        // immutability contract: every operation returns a new value and leaves its operands bit for bit unchanged
        Random r = new Random(seed);
        int n = 1 + r.nextInt(3);
        Operator a = Seeds.randomMatrix(r, n), b = Seeds.randomMatrix(r, n);
        double[] ar = a.reArray(), ai = a.imArray(), br = b.reArray(), bi = b.imArray();
        Object[] results = {a.plus(b), a.minus(b), a.times(b), a.scale(2), a.scale(new Complex(0, 1)), a.timesI(),
                a.dagger(), a.transpose(), a.conjugate(), a.commutator(b), a.anticommutator(b), a.trace(), a.inner(b),
                a.norm(), a.norm1(), a.distance(b), a.kron(b), a.exp(), a.power(3), a.toEjml(), a.toString(),
                Superoperator.sandwich(a, b).apply(b), Superoperator.kraus(List.of(a, b)).choi(),
                HilbertSpace.of(n, n).partialTrace(a.kron(b), 0), Lindbladian.builder(Hamiltonian.constant(
                        b.plus(b.dagger()))).jump(1, a).build().at(0).apply(b)};
        assertEquals(25, results.length);
        assertArrayEquals(ar, a.reArray(), 0);
        assertArrayEquals(ai, a.imArray(), 0);
        assertArrayEquals(br, b.reArray(), 0);
        assertArrayEquals(bi, b.imArray(), 0);
        // the zero-allocation coefficient call writes only its output
        double[] out = {7, 7, 7};
        Hamiltonian.builder(n).term(0.5, Operator.identity(n)).build().coefficients(1.0, out);
        assertArrayEquals(new double[]{0.5, 7, 7}, out, 0);
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource(CASES)
    void stateVectorOperationsAgreeWithOperators(long seed) {
        Random r = new Random(seed);
        int n = dim(r), m = dim(r);
        StateVector a = randomState(r, n), b = randomState(r, m), c = randomState(r, n);
        Operator ua = Seeds.randomMatrix(r, n), ub = Seeds.randomMatrix(r, m);
        // (A⊗B)(ψ⊗φ) = Aψ ⊗ Bφ
        StateVector lhs = a.kron(b).apply(ua.kron(ub)), rhs = a.apply(ua).kron(b.apply(ub));
        assertTrue(lhs.distance(rhs) <= 1e-13 * ua.norm() * ub.norm() * a.norm() * b.norm());
        // |ψ⟩⟨ψ| is Hermitian with trace ‖ψ‖², ⟨ψ|A|ψ⟩ = tr(A|ψ⟩⟨ψ|)
        Operator rho = a.toDensity();
        assertTrue(rho.isHermitian(0));
        assertEquals(a.norm() * a.norm(), rho.trace().getReal(), 1e-13 * a.norm() * a.norm());
        assertTrue(a.expectation(ua).subtract(ua.times(rho).trace()).abs() <= 1e-13 * ua.norm() * a.norm() * a.norm() * n);
        // ψ − φ = ψ + (−1)φ, ⟨ψ|zφ⟩ = z⟨ψ|φ⟩, probabilities sum to ‖ψ‖²
        assertEquals(a.plus(c.scale(-1)), a.minus(c));
        Complex z = new Complex(r.nextGaussian(), r.nextGaussian());
        assertTrue(a.inner(c.scale(z)).subtract(a.inner(c).multiply(z)).abs() <= 1e-13 * a.norm() * c.norm() * z.abs());
        double s = 0;
        for (double p : a.probabilities()) {
            s += p;
        }
        assertEquals(a.norm() * a.norm(), s, 1e-13 * s);
        assertEquals(1.0, a.normalized().norm(), 1e-15);
        // partial trace of a product state's density matrix
        HilbertSpace hs = HilbertSpace.of(n, m);
        Operator joint = a.normalized().kron(b.normalized()).toDensity();
        close(b.normalized().toDensity(), hs.partialTrace(joint, 0), 1e-14 * n, "tr_0 |ψφ⟩⟨ψφ|");
    }

    private static StateVector randomState(Random r, int n) {
        double[] re = new double[n], im = new double[n];
        for (int k = 0; k < n; k++) {
            re[k] = r.nextGaussian();
            im[k] = r.nextGaussian();
        }
        return StateVector.of(re, im);
    }
}
