package org.liepath.algebra;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Spin;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Reference checks on the classical compact algebras built from explicit matrix generators.
 *
 * <p>Tolerances: structure constants and Killing forms are sums of O(m) products of entries computed from O(N)-term
 * matrix products, so their rounding error is a small multiple of N·m·ε ≈ 1e-14 here; we use 1e-12.
 */
class ClassicalAlgebrasTest {
    static final double TOL = 1e-12;

    /** ε_abc, the Levi-Civita symbol. */
    static double eps(int a, int b, int c) {
        return (a - b) * (b - c) * (c - a) / 2.0;
    }

    /** Structure constants f_ab^k in the caller's (unnormalised, orthogonal) basis t, from the algebra's constants. */
    static double f(LieAlgebra g, List<Operator> t, int a, int b, int k) {
        double sa = t.get(a).norm(), sb = t.get(b).norm(), sk = t.get(k).norm();
        // t_a = s_a e_a, so [t_a, t_b] = Σ_k (s_a s_b / s_k) c_ab^k t_k
        return g.structureConstants().get(a, b, k) * sa * sb / sk;
    }

    static List<Operator> minusIHalf(List<Operator> hermitian) {
        List<Operator> out = new ArrayList<>();
        for (Operator h : hermitian) {
            out.add(h.timesI().scale(-0.5));
        }
        return out;
    }

    @Test
    void su2StructureConstantsAreLeviCivitaInTheBasisMinusIHalfSigma() {
        // [σ_a, σ_b] = 2i ε_abc σ_c, so e_a = −(i/2)σ_a obeys [e_a, e_b] = ε_abc e_c (standard; e.g. Wikipedia
        // "Structure constants"; the check values are in the project's check list §1.1)
        List<Operator> t = minusIHalf(List.of(Pauli.x(), Pauli.y(), Pauli.z()));
        LieAlgebra g = LieAlgebra.spannedBy(t);
        for (int a = 0; a < 3; a++) {
            for (int b = 0; b < 3; b++) {
                for (int c = 0; c < 3; c++) {
                    assertEquals(eps(a, b, c), f(g, t, a, b, c), TOL, a + "," + b + "," + c);
                }
            }
        }
        // basis iσ_a: f_abc = −2 ε_abc (same source)
        List<Operator> is = List.of(Pauli.x().timesI(), Pauli.y().timesI(), Pauli.z().timesI());
        LieAlgebra h = LieAlgebra.spannedBy(is);
        assertEquals(-2.0, f(h, is, 0, 1, 2), TOL);
        assertEquals(2.0, f(h, is, 1, 0, 2), TOL);
        // Killing form K(e_a, e_b) = −2 δ_ab for e_a = −(i/2)σ_a (= 4 tr(e_a e_b)); in the orthonormal basis
        // e'_a = √2 e_a it is −4 δ_ab
        double[][] k = g.killingForm();
        for (int a = 0; a < 3; a++) {
            for (int b = 0; b < 3; b++) {
                double s = t.get(a).norm() * t.get(b).norm();
                assertEquals(a == b ? -2.0 : 0.0, k[a][b] * s, TOL);
            }
        }
    }

    /** λ_1 … λ_8 written out from Gell-Mann's definition (M. Gell-Mann, Phys. Rev. 125, 1067 (1962)). */
    static List<Operator> gellMann() {
        double r3 = 1 / Math.sqrt(3);
        double[][] z = new double[3][3];
        List<Operator> l = new ArrayList<>();
        l.add(Operator.real(new double[][] {{0, 1, 0}, {1, 0, 0}, {0, 0, 0}}));
        l.add(Operator.of(z, new double[][] {{0, -1, 0}, {1, 0, 0}, {0, 0, 0}}));
        l.add(Operator.real(new double[][] {{1, 0, 0}, {0, -1, 0}, {0, 0, 0}}));
        l.add(Operator.real(new double[][] {{0, 0, 1}, {0, 0, 0}, {1, 0, 0}}));
        l.add(Operator.of(z, new double[][] {{0, 0, -1}, {0, 0, 0}, {1, 0, 0}}));
        l.add(Operator.real(new double[][] {{0, 0, 0}, {0, 0, 1}, {0, 1, 0}}));
        l.add(Operator.of(z, new double[][] {{0, 0, 0}, {0, 0, -1}, {0, 1, 0}}));
        l.add(Operator.real(new double[][] {{r3, 0, 0}, {0, r3, 0}, {0, 0, -2 * r3}}));
        return l;
    }

    @Test
    void su3StructureConstantsMatchTheGellMannTable() {
        // f_123 = 1, f_147 = f_246 = f_257 = f_345 = 1/2, f_156 = f_367 = −1/2, f_458 = f_678 = √3/2, totally
        // antisymmetric, for T_a = −(i/2)λ_a with [T_a, T_b] = f_abc T_c (Gell-Mann 1962; tabulated in H. Haber,
        // "Properties of the Gell-Mann matrices", UCSC Physics 251 notes; check list §1.2)
        double h = 0.5, s = Math.sqrt(3) / 2;
        double[][] table = {{1, 2, 3, 1}, {1, 4, 7, h}, {1, 5, 6, -h}, {2, 4, 6, h}, {2, 5, 7, h}, {3, 4, 5, h},
                {3, 6, 7, -h}, {4, 5, 8, s}, {6, 7, 8, s}};
        double[][][] want = new double[8][8][8];
        int[][] perms = {{0, 1, 2, 1}, {1, 2, 0, 1}, {2, 0, 1, 1}, {1, 0, 2, -1}, {0, 2, 1, -1}, {2, 1, 0, -1}};
        for (double[] row : table) {
            int[] idx = {(int) row[0] - 1, (int) row[1] - 1, (int) row[2] - 1};
            for (int[] p : perms) {
                want[idx[p[0]]][idx[p[1]]][idx[p[2]]] = p[3] * row[3];
            }
        }
        List<Operator> t = minusIHalf(gellMann());
        LieAlgebra g = LieAlgebra.spannedBy(t);
        assertEquals(8, g.dimension());
        double[][] contraction = new double[8][8];
        for (int a = 0; a < 8; a++) {
            for (int b = 0; b < 8; b++) {
                for (int c = 0; c < 8; c++) {
                    double got = f(g, t, a, b, c);
                    assertEquals(want[a][b][c], got, TOL, "f_" + (a + 1) + (b + 1) + (c + 1));
                    for (int d = 0; d < 8; d++) {
                        contraction[a][d] += got * f(g, t, d, b, c);
                    }
                }
            }
        }
        // Σ_cd f_acd f_bcd = N δ_ab = 3 δ_ab (check list §1.2)
        for (int a = 0; a < 8; a++) {
            for (int b = 0; b < 8; b++) {
                assertEquals(a == b ? 3.0 : 0.0, contraction[a][b], 1e-11);
            }
        }
        assertEquals("su(3)", g.type());
    }

    /** K(X, Y) = c·tr(XY) on the basis, with c = 2n (su(n)), n−2 (so(n)), 2m+2 (sp(2m), 2m×2m). */
    static void assertKillingIsTraceMultiple(LieAlgebra g, double c) {
        double[][] k = g.killingForm();
        List<Operator> e = g.basis();
        for (int i = 0; i < e.size(); i++) {
            for (int j = 0; j < e.size(); j++) {
                double tr = e.get(i).times(e.get(j)).trace().getReal();
                assertEquals(c * tr, k[i][j], TOL * Math.max(1, Math.abs(c)), "K[" + i + "][" + j + "]");
            }
        }
    }

    // Killing-form normalisations: Wikipedia "Killing form", section "Matrix elements" (table for gl, sl/su, so, sp);
    // check list §1.5

    @ParameterizedTest(name = "su({0})")
    @ValueSource(ints = {2, 3, 4, 5})
    void suDimensionRankKilling(int n) {
        // dim su(n) = n² − 1, rank n − 1 (W. Fulton, J. Harris, Representation Theory, 1991, Lecture 15)
        LieAlgebra g = LieAlgebra.generatedBy(Gens.hermitian(Gens.su(n)));
        assertEquals(n * n - 1, g.dimension());
        assertEquals(n - 1, g.rank());
        assertKillingIsTraceMultiple(g, 2 * n);
        assertEquals("su(" + n + ")", g.type());
        assertTrue(g.isSemisimple());
        assertTrue(g.isFullUnitary());
    }

    @ParameterizedTest(name = "so({0})")
    @ValueSource(ints = {3, 4, 5, 6, 7})
    void soDimensionRankKilling(int n) {
        // dim so(n) = n(n−1)/2, rank ⌊n/2⌋ (Fulton & Harris, Lectures 18–19)
        LieAlgebra g = LieAlgebra.generatedBy(Gens.hermitian(Gens.so(n)));
        assertEquals(n * (n - 1) / 2, g.dimension());
        assertEquals(n / 2, g.rank());
        assertKillingIsTraceMultiple(g, n - 2);
        assertFalse(g.isFullUnitary());
    }

    @ParameterizedTest(name = "sp({0})")
    @ValueSource(ints = {1, 2, 3})
    void spDimensionRankKilling(int m) {
        // compact sp(2m), 2m×2m: dim m(2m+1), rank m (Fulton & Harris, Lecture 16)
        LieAlgebra g = LieAlgebra.generatedBy(Gens.hermitian(Gens.sp(m)));
        assertEquals(m * (2 * m + 1), g.dimension());
        assertEquals(m, g.rank());
        assertKillingIsTraceMultiple(g, 2 * m + 2);
    }

    @Test
    void exceptionalIsomorphismsComeOutUnderCanonicalNames() {
        // so(3) ≅ su(2) ≅ sp(2); so(4) ≅ su(2) ⊕ su(2); so(5) ≅ sp(4); so(6) ≅ su(4) (Fulton & Harris §§19–20)
        assertEquals("su(2)", LieAlgebra.spannedBy(Gens.so(3)).type());
        assertEquals("su(2)", LieAlgebra.spannedBy(Gens.sp(1)).type());
        LieAlgebra so4 = LieAlgebra.spannedBy(Gens.so(4));
        assertEquals("su(2) ⊕ su(2)", so4.type());
        assertEquals(2, so4.simpleIdeals().size());
        assertEquals(3, so4.simpleIdeals().get(0).dimension());
        assertEquals("so(5)", LieAlgebra.spannedBy(Gens.so(5)).type());
        assertEquals("so(5)", LieAlgebra.spannedBy(Gens.sp(2)).type());
        assertEquals("su(4)", LieAlgebra.spannedBy(Gens.so(6)).type());
        // the 10 two-qubit strings commuting-complement of 5 anticommuting ones span so(5) = sp(4) (check list §1.4)
        List<Operator> ten = new ArrayList<>();
        for (String s : new String[] {"IX", "IY", "IZ", "XX", "XY", "XZ", "YX", "YY", "YZ", "ZI"}) {
            ten.add(Pauli.string(s));
        }
        assertEquals("so(5)", LieAlgebra.spannedBy(ten).type());
    }

    @Test
    void so7AndSp6AreToldApartByTheirShortRoots() {
        // B_3 and C_3 share dimension 21 and rank 3; B_3 has 3 pairs of short roots, C_3 has 6
        // (J. E. Humphreys, Introduction to Lie Algebras and Representation Theory, 1972, §12.1)
        LieAlgebra so7 = LieAlgebra.spannedBy(Gens.so(7));
        LieAlgebra sp6 = LieAlgebra.spannedBy(Gens.sp(3));
        assertEquals(21, so7.dimension());
        assertEquals(21, sp6.dimension());
        assertEquals(so7.rank(), sp6.rank());
        assertEquals("so(7)", so7.type());
        assertEquals("sp(6)", sp6.type());
    }

    @Test
    void reductiveAlgebraSplitsIntoCentreAndIdeals() {
        // IX, IY, IZ, ZX, ZY, ZZ span P+ ⊗ su(2) ⊕ P− ⊗ su(2) (P± = (1 ± Z)/2, block-diagonal), and II adds a centre
        List<Operator> gens = new ArrayList<>();
        for (String s : new String[] {"II", "IX", "IY", "IZ", "ZX", "ZY", "ZZ"}) {
            gens.add(Pauli.string(s));
        }
        LieAlgebra g = LieAlgebra.generatedBy(gens);
        assertEquals(7, g.dimension());
        assertEquals(1, g.center().dimension());
        assertTrue(g.center().contains(Pauli.string("II")));
        assertEquals("su(2) ⊕ su(2) ⊕ u(1)", g.type());
        assertEquals(3, g.rank());
        assertFalse(g.isSemisimple());
        assertFalse(g.isAbelian());
        assertEquals(6, g.derived().dimension());
        assertTrue(g.derived().isSemisimple());
        assertTrue(g.center().isAbelian());
        assertTrue(g.center().isNilpotent());
        assertEquals("u(1)", g.center().type());
    }

    @Test
    void complexSpanOfTheSpinLadderIsSl2C() {
        // [S_z, S_±] = ±S_±, [S_+, S_−] = 2 S_z (standard angular-momentum algebra, e.g. J. J. Sakurai, Modern
        // Quantum Mechanics, 1994, §3.5)
        Spin s = Spin.of(0.5);
        List<Operator> b = List.of(s.plus(), s.z(), s.minus());
        LieAlgebra g = LieAlgebra.complexSpan(b);
        assertTrue(g.isComplex());
        assertEquals(3, g.dimension());
        StructureConstants c = g.structureConstants();
        assertTrue(c.isComplex());
        double sp = b.get(0).norm(), sz = b.get(1).norm(), sm = b.get(2).norm();
        // [S_z, S_+] = S_+  →  c_10^0 · s_z s_+ / s_+ = 1
        assertEquals(1.0, c.getComplex(1, 0, 0).getReal() * sz * sp / sp, TOL);
        assertEquals(-1.0, c.getComplex(1, 2, 2).getReal() * sz * sm / sm, TOL);
        assertEquals(2.0, c.getComplex(0, 2, 1).getReal() * sp * sm / sz, TOL);
        assertEquals(0.0, c.getComplex(0, 2, 1).getImaginary(), TOL);
        assertEquals("sl(2,C)", g.type());
        assertEquals(1, g.rank());
        assertTrue(g.isSemisimple());
        // σ_x = S_+ + S_− has complex coordinates (‖S_+‖, 0, ‖S_−‖) in the normalised basis
        Complex[] z = g.complexCoordinates(Pauli.x());
        assertEquals(sp, z[0].getReal(), TOL);
        assertEquals(0.0, z[1].abs(), TOL);
        assertEquals(sm, z[2].getReal(), TOL);
        // complex Killing form of sl(2,C): K(S_z, S_z) = tr(ad² S_z) = 2 (eigenvalues 1, 0, −1 of ad S_z)
        assertEquals(2.0, g.complexKillingForm()[1][1].getReal() * sz * sz, TOL);
    }

    @Test
    void solvableAndNilpotentComplexAlgebras() {
        // upper-triangular 2×2 matrices (a Borel subalgebra) are solvable, not nilpotent; strictly upper-triangular
        // 3×3 matrices (Heisenberg algebra) are nilpotent (Humphreys 1972, §3.1–3.2)
        LieAlgebra borel = LieAlgebra.complexSpan(List.of(Gens.unit(2, 0, 0, 1, 0), Gens.unit(2, 0, 1, 1, 0),
                Gens.unit(2, 1, 1, 1, 0)));
        assertTrue(borel.isSolvable());
        assertFalse(borel.isNilpotent());
        assertFalse(borel.isSemisimple());
        assertEquals(1, borel.derived().dimension());
        assertEquals("unknown", borel.type());
        LieAlgebra heis = LieAlgebra.complexSpan(List.of(Gens.unit(3, 0, 1, 1, 0), Gens.unit(3, 1, 2, 1, 0),
                Gens.unit(3, 0, 2, 1, 0)));
        assertTrue(heis.isNilpotent());
        assertTrue(heis.isSolvable());
        assertEquals(1, heis.center().dimension());
        assertTrue(heis.center().contains(Gens.unit(3, 0, 2, 1, 0)));
    }

    @Test
    void degenerateAlgebras() {
        LieAlgebra zero = LieAlgebra.generatedBy(List.of(Operator.zero(2)));
        assertEquals(0, zero.dimension());
        assertEquals("0", zero.type());
        assertEquals(0, zero.rank());
        LieAlgebra u1 = LieAlgebra.generatedBy(List.of(Operator.identity(3)));
        assertEquals("u(1)", u1.type());
        assertEquals(1, u1.center().dimension());
        assertTrue(u1.isAbelian() && u1.isSolvable() && u1.isNilpotent());
        assertFalse(u1.isSemisimple());
        // u(2) = su(2) ⊕ u(1) is full unitary
        LieAlgebra u2 = LieAlgebra.generatedBy(List.of(Pauli.x(), Pauli.y(), Pauli.i()));
        assertEquals("su(2) ⊕ u(1)", u2.type());
        assertTrue(u2.isFullUnitary());
    }

    @Test
    void commutationTableAndPrintedForms() {
        List<Operator> zs = List.of(Pauli.string("ZI"), Pauli.string("IZ"), Pauli.string("ZZ"));
        LieAlgebra torus = LieAlgebra.spannedBy(zs);
        assertTrue(torus.isAbelian());
        assertEquals("u(1)^3", torus.type());
        CommutationTable t = torus.commutationTable();
        assertEquals(0, t.nonCommutingPairs());
        LieAlgebra su2 = LieAlgebra.generatedBy(List.of(Pauli.x(), Pauli.y()));
        CommutationTable u = su2.commutationTable();
        assertEquals(3, u.nonCommutingPairs());
        assertTrue(u.commutes(1, 1));
        assertEquals(",e0,e1,e2\ne0,1,0,0\ne1,0,1,0\ne2,0,0,1\n", u.toCsv());
        assertTrue(u.toString().contains("x"));
        String sc = su2.structureConstants().toString();
        assertTrue(sc.contains("[e0, e1] ="), sc);
        assertEquals(3, su2.structureConstants().nonZeros());
    }
}
