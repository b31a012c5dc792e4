package org.liepath.core;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Reference checks of the operator families in core: Pauli matrices and strings, spin-j operators, generalized
 * Gell-Mann matrices and the su(3) structure constants.
 *
 * <p>Tolerances: all matrices here have entries that are small integers, half-integers or square roots of integers;
 * products of a few of them carry rounding of a few ulps of the largest entry, hence 1e-14 absolute for O(1) entries
 * and 1e-14·j² for spin j (J² has entries up to j(j+1)).
 */
class AlgebraicIdentitiesTest {
    private static final Operator X = Pauli.x(), Y = Pauli.y(), Z = Pauli.z(), I2 = Pauli.i();

    private static void close(Operator expected, Operator actual, double tol, String what) {
        assertTrue(expected.distance(actual) <= tol,
                () -> what + ": distance " + expected.distance(actual) + " > " + tol + "\nexpected " + expected
                        + "\nactual " + actual);
    }

    // ------------------------------------------------------------------ Pauli

    @Test
    void pauliProductsFollowTheCyclicRule() {
        // σaσb = δab I + i ε_abc σc (E. Merzbacher, Quantum Mechanics, 3rd ed., Wiley 1998, eq. (16.59) [M for the
        // equation number]); these are exact in floating point, so we demand exact equality
        assertEquals(Z.timesI(), X.times(Y), "XY = iZ");
        assertEquals(X.timesI(), Y.times(Z), "YZ = iX");
        assertEquals(Y.timesI(), Z.times(X), "ZX = iY");
        assertEquals(Z.timesI().scale(-1), Y.times(X), "YX = −iZ");
        for (Operator p : List.of(X, Y, Z)) {
            assertEquals(I2, p.times(p), "σ² = I");
            assertEquals(Complex.ZERO, p.trace());
            assertTrue(p.isHermitian(0));
        }
        // [σa, σb] = 2i ε_abc σc, tr(σaσb) = 2δab (Wikipedia, "Structure constants"; common practice)
        assertEquals(Z.timesI().scale(2), X.commutator(Y));
        assertEquals(new Complex(2, 0), X.inner(X));
        assertEquals(Complex.ZERO, X.inner(Y));
        // σz|0⟩ = +|0⟩ (convention: |0⟩ = (1,0)ᵀ is the +1 eigenvector)
        assertEquals(StateVector.unit(2, 0), StateVector.unit(2, 0).apply(Z));
    }

    @Test
    void pauliStringsAreKroneckerProductsWithQubitZeroLeftmost() {
        // convention (common practice, and stated in the Pauli Javadoc): "XZI" = X ⊗ Z ⊗ I
        assertEquals(X.kron(Z).kron(I2), Pauli.string("XZI"));
        assertEquals(Y.kron(I2).kron(X).kron(Z), Pauli.string("YIXZ"));
        assertEquals(Pauli.string("YIXZ"), Pauli.string("yixz"), "lower case letters");
        String letters = "IXYZ";
        // all 64 three-letter strings against explicit Kronecker products
        for (int a = 0; a < 4; a++) {
            for (int b = 0; b < 4; b++) {
                for (int c = 0; c < 4; c++) {
                    String s = "" + letters.charAt(a) + letters.charAt(b) + letters.charAt(c);
                    Operator explicit = Pauli.letter(s.charAt(0)).kron(Pauli.letter(s.charAt(1)))
                            .kron(Pauli.letter(s.charAt(2)));
                    assertEquals(explicit, Pauli.string(s), s);
                }
            }
        }
        // qubit 0 is the most significant bit: X on qubit 0 of |000⟩ gives |100⟩ = index 4
        assertEquals(StateVector.unit(8, 4), StateVector.unit(8, 0).apply(Pauli.string("XII")));
        assertEquals(StateVector.unit(8, 1), StateVector.unit(8, 0).apply(Pauli.string("IIX")));
    }

    // ------------------------------------------------------------------ spin

    @ParameterizedTest(name = "j = {0}")
    @ValueSource(doubles = {0.5, 1, 1.5, 2, 3.5, 10})
    void spinOperatorsSatisfyTheAngularMomentumAlgebra(double j) {
        // [Jx, Jy] = iJz and cyclic, J² = j(j+1) I (J. J. Sakurai, Modern Quantum Mechanics, rev. ed. 1994,
        // eqs. (3.1.20) and (3.5.34) [M for the equation numbers])
        Spin s = Spin.of(j);
        Operator jx = s.x(), jy = s.y(), jz = s.z();
        double tol = 1e-14 * Math.max(1, j * j) * s.dim();
        close(jz.timesI(), jx.commutator(jy), tol, "[Jx,Jy] = iJz");
        close(jx.timesI(), jy.commutator(jz), tol, "[Jy,Jz] = iJx");
        close(jy.timesI(), jz.commutator(jx), tol, "[Jz,Jx] = iJy");
        close(Operator.identity(s.dim()).scale(j * (j + 1)), s.squared(), tol, "J² = j(j+1)I");
        assertEquals((int) Math.round(2 * j) + 1, s.dim());
        for (Operator op : List.of(jx, jy, jz)) {
            assertTrue(op.isHermitian(0), "Hermitian");
            assertTrue(op.trace().abs() <= tol, "traceless");
        }
        // J± = Jx ± iJy and J− = (J+)†
        close(jx.plus(jy.timesI()), s.plus(), tol, "J+ = Jx + iJy");
        close(jx.minus(jy.timesI()), s.minus(), tol, "J− = Jx − iJy");
        assertEquals(s.plus().dagger(), s.minus());
        // Jz = diag(j, j−1, …, −j)
        for (int k = 0; k < s.dim(); k++) {
            assertEquals(j - k, jz.re(k, k), 0.0);
            assertEquals(j - k, s.m(k), 0.0);
        }
    }

    @ParameterizedTest(name = "j = {0}")
    @ValueSource(doubles = {0.5, 1, 1.5, 2, 3.5, 10})
    void ladderMatrixElementsAreCondonShortley(double j) {
        // ⟨m+1|J+|m⟩ = sqrt((j − m)(j + m + 1)), ⟨m−1|J−|m⟩ = sqrt((j + m)(j − m + 1)), real and positive
        // (Sakurai 1994, eqs. (3.5.39)–(3.5.41) [M]); written in the product form so that the reference is computed
        // differently from the library's j(j+1) − m(m+1)
        Spin s = Spin.of(j);
        Operator jp = s.plus(), jm = s.minus();
        int d = s.dim();
        for (int row = 0; row < d; row++) {
            for (int col = 0; col < d; col++) {
                double m = j - col;
                double expectP = row == col - 1 ? Math.sqrt((j - m) * (j + m + 1)) : 0;
                double expectM = row == col + 1 ? Math.sqrt((j + m) * (j - m + 1)) : 0;
                assertEquals(expectP, jp.re(row, col), 1e-13 * j, "J+ at " + row + "," + col);
                assertEquals(expectM, jm.re(row, col), 1e-13 * j, "J− at " + row + "," + col);
                assertEquals(0.0, jp.im(row, col), 0.0);
            }
        }
    }

    @Test
    void spinOneHalfIsHalfThePauliMatrices() {
        Spin s = Spin.of(0.5);
        assertEquals(X.scale(0.5), s.x());
        assertEquals(Y.scale(0.5), s.y());
        assertEquals(Z.scale(0.5), s.z());
        assertEquals("Spin 1/2 (dimension 2)", s.toString());
        assertEquals("Spin 7/2 (dimension 8)", Spin.of(3.5).toString());
        assertEquals("Spin 10 (dimension 21)", Spin.of(10).toString());
    }

    // ------------------------------------------------------------------ Gell-Mann

    @ParameterizedTest(name = "d = {0}")
    @ValueSource(ints = {2, 3, 4, 5, 6})
    void gellMannMatricesAreAnOrthogonalTracelessHermitianBasis(int d) {
        // tr(λaλb) = 2δab, λa = λa†, tr λa = 0, d² − 1 of them (Bertlmann & Krammer, J. Phys. A 41 (2008) 235303,
        // eqs. (3)–(6) [M for the equation numbers])
        List<Operator> gm = Levels.gellMann(d);
        assertEquals(d * d - 1, gm.size());
        for (int a = 0; a < gm.size(); a++) {
            assertTrue(gm.get(a).isHermitian(0));
            assertTrue(gm.get(a).trace().abs() <= 1e-15);
            for (int b = 0; b < gm.size(); b++) {
                Complex tr = gm.get(a).times(gm.get(b)).trace();
                assertEquals(a == b ? 2.0 : 0.0, tr.getReal(), 1e-14, "tr(λ" + a + "λ" + b + ")");
                assertEquals(0.0, tr.getImaginary(), 1e-14);
            }
        }
        if (d == 2) {
            assertEquals(List.of(X, Y, Z), gm);
        }
    }

    @Test
    void gellMannMatricesOfSu3AreTheStandardOnes() {
        // λ2 = [[0,−i,0],[i,0,0],[0,0,0]], λ8 = diag(1,1,−2)/√3 (Encyclopedia of Mathematics, "Gell-Mann matrices")
        List<Operator> gm = Levels.gellMann(3);
        assertEquals(Operator.of(new double[][]{{0, 0, 0}, {0, 0, 0}, {0, 0, 0}},
                new double[][]{{0, -1, 0}, {1, 0, 0}, {0, 0, 0}}), gm.get(1));
        // sqrt(2/6) vs 1/√3: two roundings of the same number, a few ulps apart
        close(Operator.diagonal(1, 1, -2).scale(1 / Math.sqrt(3)), gm.get(7), 1e-15, "λ8");
        assertEquals(Operator.real(new double[][]{{0, 0, 0}, {0, 0, 1}, {0, 1, 0}}), gm.get(5), "λ6");
    }

    /** f_abc as tabulated (a &lt; b &lt; c) in Wikipedia "Gell-Mann matrices", Commutation relations, citing H. Haber,
     * Properties of the Gell-Mann matrices, Physics 251 notes, UC Santa Cruz. */
    private static double[][][] referenceF() {
        double[][][] f = new double[8][8][8];
        double h = 0.5, r = Math.sqrt(3) / 2;
        double[][] table = {{1, 2, 3, 1}, {1, 4, 7, h}, {1, 5, 6, -h}, {2, 4, 6, h}, {2, 5, 7, h}, {3, 4, 5, h},
                {3, 6, 7, -h}, {4, 5, 8, r}, {6, 7, 8, r}};
        for (double[] e : table) {
            int a = (int) e[0] - 1, b = (int) e[1] - 1, c = (int) e[2] - 1;
            double v = e[3];
            // total antisymmetry
            f[a][b][c] = v; f[b][c][a] = v; f[c][a][b] = v;
            f[b][a][c] = -v; f[a][c][b] = -v; f[c][b][a] = -v;
        }
        return f;
    }

    /** d_abc (a ≤ b ≤ c), commonly tabulated (e.g. Haber's Physics 251 notes [M]); computed independently (SymPy). */
    private static double[][][] referenceD() {
        double[][][] d = new double[8][8][8];
        double s = 1 / Math.sqrt(3);
        double[][] table = {{1, 1, 8, s}, {2, 2, 8, s}, {3, 3, 8, s}, {8, 8, 8, -s},
                {4, 4, 8, -s / 2}, {5, 5, 8, -s / 2}, {6, 6, 8, -s / 2}, {7, 7, 8, -s / 2},
                {1, 4, 6, 0.5}, {1, 5, 7, 0.5}, {2, 5, 6, 0.5}, {3, 4, 4, 0.5}, {3, 5, 5, 0.5},
                {2, 4, 7, -0.5}, {3, 6, 6, -0.5}, {3, 7, 7, -0.5}};
        for (double[] e : table) {
            int[] p = {(int) e[0] - 1, (int) e[1] - 1, (int) e[2] - 1};
            int[][] perms = {{0, 1, 2}, {0, 2, 1}, {1, 0, 2}, {1, 2, 0}, {2, 0, 1}, {2, 1, 0}};
            for (int[] q : perms) {
                d[p[q[0]]][p[q[1]]][p[q[2]]] = e[3];
            }
        }
        return d;
    }

    @Test
    void su3StructureConstantsMatchTheTables() {
        // f_abc = −(i/4) tr(λa[λb,λc]), d_abc = (1/4) tr(λa{λb,λc}) (conventions of Wikipedia
        // "Gell-Mann matrices", citing H. Haber, Properties of the Gell-Mann matrices); all 512 entries, abs 1e-14
        List<Operator> gm = Levels.gellMann(3);
        double[][][] fRef = referenceF(), dRef = referenceD();
        double[][][] f = new double[8][8][8], d = new double[8][8][8];
        for (int a = 0; a < 8; a++) {
            for (int b = 0; b < 8; b++) {
                for (int c = 0; c < 8; c++) {
                    Complex tf = gm.get(a).times(gm.get(b).commutator(gm.get(c))).trace().multiply(new Complex(0, -0.25));
                    Complex td = gm.get(a).times(gm.get(b).anticommutator(gm.get(c))).trace().multiply(0.25);
                    assertEquals(0.0, tf.getImaginary(), 1e-14, "Im f");
                    assertEquals(0.0, td.getImaginary(), 1e-14, "Im d");
                    f[a][b][c] = tf.getReal();
                    d[a][b][c] = td.getReal();
                    assertEquals(fRef[a][b][c], f[a][b][c], 1e-14, "f_" + (a + 1) + (b + 1) + (c + 1));
                    assertEquals(dRef[a][b][c], d[a][b][c], 1e-14, "d_" + (a + 1) + (b + 1) + (c + 1));
                }
            }
        }
        // contraction identities for su(N), N = 3: Σ f_acd f_bcd = N δab, Σ d_acd d_bcd = (N² − 4)/N δab,
        // Σ f² = N(N² − 1) = 24, Σ d² = 40/3 (computed independently with exact arithmetic)
        double sumF2 = 0, sumD2 = 0;
        for (int a = 0; a < 8; a++) {
            for (int b = 0; b < 8; b++) {
                double ff = 0, dd = 0;
                for (int c = 0; c < 8; c++) {
                    for (int e = 0; e < 8; e++) {
                        ff += f[a][c][e] * f[b][c][e];
                        dd += d[a][c][e] * d[b][c][e];
                    }
                }
                assertEquals(a == b ? 3.0 : 0.0, ff, 1e-13, "Σ f f");
                assertEquals(a == b ? 5.0 / 3 : 0.0, dd, 1e-13, "Σ d d");
                if (a == b) {
                    sumF2 += ff;
                    sumD2 += dd;
                }
            }
        }
        assertEquals(24.0, sumF2, 1e-12);
        assertEquals(40.0 / 3, sumD2, 1e-12);
        // and the defining relation [λa, λb] = 2i Σ_c f_abc λc, reconstructed from the computed f
        for (int a = 0; a < 8; a++) {
            for (int b = 0; b < 8; b++) {
                Operator rhs = Operator.zero(3);
                for (int c = 0; c < 8; c++) {
                    rhs = rhs.plus(gm.get(c).scale(2 * f[a][b][c]));
                }
                close(rhs.timesI(), gm.get(a).commutator(gm.get(b)), 1e-14, "[λa, λb]");
            }
        }
    }

    @Test
    void gellMannBasesNest() {
        // with the documented order, the first (d−1)² − 1 matrices of dimension d are those of dimension d−1 padded
        // with a zero row and column, and the last one is diag(1, …, 1, −(d−1))·sqrt(2/(d(d−1))) (Bertlmann & Krammer
        // 2008, eq. (5) [M])
        for (int d = 3; d <= 6; d++) {
            List<Operator> big = Levels.gellMann(d), small = Levels.gellMann(d - 1);
            for (int a = 0; a < small.size(); a++) {
                double[][] re = new double[d][d], im = new double[d][d];
                for (int i = 0; i < d - 1; i++) {
                    for (int j = 0; j < d - 1; j++) {
                        re[i][j] = small.get(a).re(i, j);
                        im[i][j] = small.get(a).im(i, j);
                    }
                }
                assertEquals(Operator.of(re, im), big.get(a), "d = " + d + ", a = " + a);
            }
            double[] diag = new double[d];
            java.util.Arrays.fill(diag, 1);
            diag[d - 1] = -(d - 1);
            close(Operator.diagonal(diag).scale(Math.sqrt(2.0 / (d * (d - 1.0)))), big.get(d * d - 2), 1e-15, "last");
        }
    }

    // ------------------------------------------------------------------ vectorisation and embedding

    @Test
    void sandwichRealisesColumnStackingVectorisation() {
        // vec(AXB) = (Bᵀ ⊗ A) vec(X) (R. A. Horn, C. R. Johnson, Topics in Matrix Analysis, CUP 1991, Lemma 4.3.1)
        java.util.Random r = new java.util.Random(11);
        for (int n : new int[]{1, 2, 3, 5}) {
            Operator a = org.liepath.testing.Seeds.randomMatrix(r, n), b = org.liepath.testing.Seeds.randomMatrix(r, n),
                    x = org.liepath.testing.Seeds.randomMatrix(r, n);
            Superoperator s = Superoperator.sandwich(a, b);
            close(a.times(x).times(b), s.apply(x), 1e-13 * n * n, "AXB");
            assertEquals(b.transpose().kron(a), s.matrix(), "S = Bᵀ ⊗ A");
            // explicit column stacking: S[i + n j, k + n l] = A_ik B_lj
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    for (int k = 0; k < n; k++) {
                        for (int l = 0; l < n; l++) {
                            Complex expect = a.get(i, k).multiply(b.get(l, j));
                            Complex got = s.matrix().get(i + n * j, k + n * l);
                            assertEquals(0.0, expect.subtract(got).abs(), 1e-14);
                        }
                    }
                }
            }
        }
        // unitary channel = sandwich(U, U†)
        Operator u = Pauli.string("X").expMinusI(0.3);
        assertTrue(Superoperator.unitary(u).distance(Superoperator.sandwich(u, u.dagger())) <= 1e-15);
    }

    @Test
    void embedMatchesExplicitKroneckerProducts() {
        HilbertSpace hs = HilbertSpace.of(2, 3, 2);
        assertEquals(12, hs.dim());
        Operator a = Levels.gellMann(3).get(4), x = Pauli.x(), z = Pauli.z();
        Operator i2 = Operator.identity(2), i3 = Operator.identity(3);
        assertEquals(x.kron(i3).kron(i2), hs.embed(x, 0));
        assertEquals(i2.kron(a).kron(i2), hs.embed(a, 1));
        assertEquals(i2.kron(i3).kron(z), hs.embed(z, 2));
        assertEquals(x.kron(i3).kron(z), hs.embed(x, 0, z, 2));
        assertEquals(x.kron(i3).kron(z), hs.embed(z, 2, x, 0), "order of the arguments does not matter");
        assertEquals(z.kron(a).kron(x), hs.product(z, a, x));
        // embedded operators on different subsystems commute
        assertEquals(Operator.zero(12), hs.embed(x, 0).commutator(hs.embed(a, 1)));
        // basis |1 2 0⟩ = index 1·6 + 2·2 + 0 = 10
        assertEquals(StateVector.unit(12, 10), hs.basis(1, 2, 0));
        assertEquals(StateVector.unit(2, 1).kron(StateVector.unit(3, 2)).kron(StateVector.unit(2, 0)),
                hs.basis(1, 2, 0));
        // qubit embedding agrees with Pauli strings
        assertEquals(Pauli.string("IZI"), HilbertSpace.of(2, 2, 2).embed(z, 1));
    }

    @Test
    void jointEmbeddingPlacesAMultiSubsystemOperator() {
        // CNOT = |0⟩⟨0| ⊗ I + |1⟩⟨1| ⊗ X (control first; Nielsen & Chuang 2000, §1.3.2 [M]); with control and target
        // swapped it is I ⊗ |0⟩⟨0| + X ⊗ |1⟩⟨1| = (H⊗H) CNOT (H⊗H) (N&C 2000, exercise 4.20 [M])
        Operator p0 = Operator.unit(2, 0, 0), p1 = Operator.unit(2, 1, 1), i2 = Operator.identity(2);
        Operator cnot = p0.kron(i2).plus(p1.kron(X));
        HilbertSpace two = HilbertSpace.of(2, 2);
        assertEquals(cnot, two.embed(cnot, 0, 1));
        assertEquals(i2.kron(p0).plus(X.kron(p1)), two.embed(cnot, 1, 0), "control on qubit 1");
        Operator had = X.plus(Z).scale(1 / Math.sqrt(2));
        close(had.kron(had).times(cnot).times(had.kron(had)), two.embed(cnot, 1, 0), 1e-15, "H⊗H CNOT H⊗H");
        // three qubits, control 2 and target 0: |c⟩ on qubit 2 flips qubit 0
        HilbertSpace three = HilbertSpace.of(2, 2, 2);
        Operator g = three.embed(cnot, 2, 0);
        assertEquals(StateVector.unit(8, 0b101), StateVector.unit(8, 0b001).apply(g));
        assertEquals(StateVector.unit(8, 0b010), StateVector.unit(8, 0b010).apply(g));
        // a product operator placed in ascending order equals the explicit Kronecker product
        java.util.Random r = new java.util.Random(4);
        HilbertSpace hs = HilbertSpace.of(2, 3, 2);
        Operator a = org.liepath.testing.Seeds.randomMatrix(r, 2), c = org.liepath.testing.Seeds.randomMatrix(r, 2);
        Operator b = org.liepath.testing.Seeds.randomMatrix(r, 3);
        assertEquals(hs.embed(a, 0, c, 2), hs.embed(a.kron(c), 0, 2));
        assertEquals(hs.embed(a, 0, c, 2), hs.embed(c.kron(a), 2, 0));
        assertEquals(hs.product(a, b, c), hs.embed(a.kron(b).kron(c), 0, 1, 2));
        assertEquals(hs.embed(b, 1), hs.embed(b, new int[]{1}));
    }
}
