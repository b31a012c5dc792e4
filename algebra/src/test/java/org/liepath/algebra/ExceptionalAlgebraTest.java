package org.liepath.algebra;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.junit.jupiter.api.Test;
import org.liepath.core.Operator;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * The compact exceptional algebra g2 as the stabiliser in so(7) of the octonionic 3-form
 * φ = e¹²³ + e¹⁴⁵ + e¹⁶⁷ + e²⁴⁶ − e²⁵⁷ − e³⁴⁷ − e³⁵⁶ (R. L. Bryant, "Some remarks on G2-structures", Proc. Gökova
 * Geometry-Topology Conf. 2005, eq. (2.1) [form quoted from memory]; a wrong sign would put φ outside the open orbit
 * and the stabiliser would not have dimension 14, so the dimension check guards the input).
 */
class ExceptionalAlgebraTest {
    static final int[][] TERMS = {{1, 2, 3, 1}, {1, 4, 5, 1}, {1, 6, 7, 1}, {2, 4, 6, 1}, {2, 5, 7, -1}, {3, 4, 7, -1},
            {3, 5, 6, -1}};

    static double phi(int i, int j, int k) {
        for (int[] t : TERMS) {
            int[] a = {t[0] - 1, t[1] - 1, t[2] - 1};
            int[][] perms = {{0, 1, 2, 1}, {1, 2, 0, 1}, {2, 0, 1, 1}, {1, 0, 2, -1}, {0, 2, 1, -1}, {2, 1, 0, -1}};
            for (int[] p : perms) {
                if (a[p[0]] == i && a[p[1]] == j && a[p[2]] == k) {
                    return p[3] * t[3];
                }
            }
        }
        return 0;
    }

    @Test
    void stabiliserOfTheOctonionThreeFormIsG2() {
        List<Operator> so7 = Gens.so(7);
        // (A·φ)_ijk = Σ_l (A_li φ_ljk + A_lj φ_ilk + A_lk φ_ijl) for each basis element A of so(7); i < j < k
        double[][] eq = new double[35][so7.size()];
        for (int b = 0; b < so7.size(); b++) {
            Operator a = so7.get(b);
            int row = 0;
            for (int i = 0; i < 7; i++) {
                for (int j = i + 1; j < 7; j++) {
                    for (int k = j + 1; k < 7; k++) {
                        double s = 0;
                        for (int l = 0; l < 7; l++) {
                            s += a.re(l, i) * phi(l, j, k) + a.re(l, j) * phi(i, l, k) + a.re(l, k) * phi(i, j, l);
                        }
                        eq[row++][b] = s;
                    }
                }
            }
        }
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(eq, false));
        double[] sv = svd.getSingularValues();
        double[][] v = svd.getV().getData();
        List<Operator> g2 = new ArrayList<>();
        for (int c = 0; c < so7.size(); c++) {
            if (c >= sv.length || sv[c] < 1e-10 * sv[0]) {
                Operator x = Operator.zero(7);
                for (int b = 0; b < so7.size(); b++) {
                    x = x.plus(so7.get(b).scale(v[b][c]));
                }
                g2.add(x);
            }
        }
        assertEquals(14, g2.size());
        LieAlgebra g = LieAlgebra.spannedBy(g2);
        assertEquals(14, g.dimension());
        assertEquals(2, g.rank());
        assertEquals("g2", g.type());
    }
}
