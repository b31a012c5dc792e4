package org.liepath.algebra;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.SingularValueDecomposition;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Operator;
import org.liepath.testing.Seeds;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Properties of closures of seeded random generator sets. Tolerances: all quantities are O(1) sums of O(m·N) products
 * of unit-norm data, so rounding is ≲ 1e-13; 1e-10 leaves room without hiding a wrong structure constant (those are
 * O(1)).
 */
class LieAlgebraPropertiesTest {
    static final double TOL = 1e-10;

    /** Random Hermitian generators of several kinds, so that the closures are not all su(N) or u(N). */
    static List<Operator> randomGenerators(Random r) {
        int n = 2 + r.nextInt(3);
        int count = 1 + r.nextInt(3);
        int kind = r.nextInt(3);
        int split = 1 + r.nextInt(n - 1);
        List<Operator> out = new ArrayList<>();
        for (int c = 0; c < count; c++) {
            Operator h = Seeds.randomHermitian(r, n);
            if (kind == 1) {
                // i × (real antisymmetric): −iH is real antisymmetric, so the closure lies in so(N)
                double[][] im = new double[n][n];
                for (int a = 0; a < n; a++) {
                    for (int b = a + 1; b < n; b++) {
                        im[a][b] = r.nextGaussian();
                        im[b][a] = -im[a][b];
                    }
                }
                h = Operator.of(new double[n][n], im);
            } else if (kind == 2) {
                // block diagonal: commutes with the projector on the first `split` levels
                double[][] re = h.reRows(), im = h.imRows();
                for (int a = 0; a < n; a++) {
                    for (int b = 0; b < n; b++) {
                        if ((a < split) != (b < split)) {
                            re[a][b] = 0;
                            im[a][b] = 0;
                        }
                    }
                }
                h = Operator.of(re, im);
            }
            out.add(h);
        }
        return out;
    }

    /** Dimension of the span of nested commutators of −iA_k, level by level, with ranks from an SVD. */
    static int nestedCommutatorRank(List<Operator> herm) {
        int n = herm.get(0).dim();
        List<Operator> s = new ArrayList<>();
        for (Operator h : herm) {
            s.add(h.timesI().scale(-1));
        }
        List<double[]> rows = new ArrayList<>();
        List<Operator> kept = new ArrayList<>();
        List<Operator> level = new ArrayList<>(s);
        int rank = 0;
        while (!level.isEmpty()) {
            List<Operator> next = new ArrayList<>();
            for (Operator w : level) {
                double nw = w.norm();
                if (nw < 1e-9) {
                    continue;
                }
                rows.add(flatten(w.scale(1 / nw)));
                int r2 = rank(rows);
                if (r2 > rank) {
                    rank = r2;
                    kept.add(w);
                    for (Operator g : s) {
                        next.add(g.commutator(w));
                    }
                } else {
                    rows.remove(rows.size() - 1);
                }
            }
            level = next;
            if (rank == n * n) {
                break;
            }
        }
        return rank;
    }

    static double[] flatten(Operator a) {
        int n = a.dim();
        double[] v = new double[2 * n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                v[i * n + j] = a.re(i, j);
                v[n * n + i * n + j] = a.im(i, j);
            }
        }
        return v;
    }

    static int rank(List<double[]> rows) {
        double[][] a = rows.toArray(new double[0][]);
        SingularValueDecomposition svd = new SingularValueDecomposition(new Array2DRowRealMatrix(a, false));
        double[] sv = svd.getSingularValues();
        int r = 0;
        for (double x : sv) {
            if (x > 1e-8 * sv[0]) {
                r++;
            }
        }
        return r;
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void closureDimensionMatchesAnIndependentNestedCommutatorRank(long seed) {
        List<Operator> gens = randomGenerators(new Random(seed));
        LieAlgebra g = LieAlgebra.generatedBy(gens);
        int n = gens.get(0).dim();
        assertEquals(nestedCommutatorRank(gens), g.dimension());
        assertTrue(g.dimension() <= n * n);
        assertEquals(g.dimension() >= n * n - 1, g.isFullUnitary());
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void structureConstantsAreAntisymmetricAndSatisfyJacobi(long seed) {
        LieAlgebra g = LieAlgebra.generatedBy(randomGenerators(new Random(seed)));
        int m = g.dimension();
        StructureConstants c = g.structureConstants();
        double[][][] f = new double[m][m][m];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                for (int k = 0; k < m; k++) {
                    f[i][j][k] = c.get(i, j, k);
                }
            }
        }
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                for (int k = 0; k < m; k++) {
                    assertEquals(-f[j][i][k], f[i][j][k], TOL);
                    // Jacobi: [[e_i, e_j], e_k] + [[e_j, e_k], e_i] + [[e_k, e_i], e_j] = 0
                    for (int q = 0; q < m; q++) {
                        double s = 0;
                        for (int l = 0; l < m; l++) {
                            s += f[i][j][l] * f[l][k][q] + f[j][k][l] * f[l][i][q] + f[k][i][l] * f[l][j][q];
                        }
                        assertEquals(0.0, s, TOL);
                    }
                }
            }
        }
        // the adjoint matrices are the same numbers
        for (int i = 0; i < m; i++) {
            double[][] ad = g.adjoint(i);
            for (int j = 0; j < m; j++) {
                for (int k = 0; k < m; k++) {
                    assertEquals(f[i][j][k], ad[k][j], 0.0);
                }
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void closureIsIdempotentOrthonormalAndContainsItsGenerators(long seed) {
        Random r = new Random(seed);
        List<Operator> gens = randomGenerators(r);
        LieAlgebra g = LieAlgebra.generatedBy(gens);
        List<Operator> e = g.basis();
        for (int i = 0; i < e.size(); i++) {
            assertTrue(e.get(i).plus(e.get(i).dagger()).norm() < TOL, "anti-Hermitian");
            for (int j = 0; j < e.size(); j++) {
                assertEquals(i == j ? 1.0 : 0.0, e.get(i).inner(e.get(j)).getReal(), TOL);
            }
        }
        for (Operator a : gens) {
            assertTrue(g.contains(a));
        }
        assertEquals(g.dimension(), LieAlgebra.spannedBy(e).dimension());
        assertEquals(g.dimension(), LieAlgebra.generatedBy(Gens.hermitian(e)).dimension());
        // coordinates reproduce a random element of the algebra
        double[] x = new double[e.size()];
        Operator sum = Operator.zero(e.get(0).dim());
        for (int k = 0; k < x.length; k++) {
            x[k] = r.nextGaussian();
            sum = sum.plus(e.get(k).scale(x[k]));
        }
        assertArrayEquals(x, g.coordinates(sum), TOL);
        // a compact algebra is the direct sum of its centre and its derived algebra
        assertEquals(g.dimension(), g.center().dimension() + g.derived().dimension());
        assertTrue(g.rank() >= g.center().dimension());
        assertFalse(g.type().contains("unknown"), g.type());
        double[][] k = g.killingForm();
        for (int i = 0; i < k.length; i++) {
            for (int j = 0; j < k.length; j++) {
                assertEquals(k[j][i], k[i][j], TOL);
            }
        }
    }

    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void simpleIdealsCommuteAndSpanTheDerivedAlgebra(long seed) {
        LieAlgebra g = LieAlgebra.generatedBy(randomGenerators(new Random(seed)));
        List<LieAlgebra> ideals = g.simpleIdeals();
        int total = 0;
        for (int a = 0; a < ideals.size(); a++) {
            total += ideals.get(a).dimension();
            assertTrue(ideals.get(a).isSemisimple());
            for (int b = a + 1; b < ideals.size(); b++) {
                for (Operator x : ideals.get(a).basis()) {
                    for (Operator y : ideals.get(b).basis()) {
                        assertTrue(x.commutator(y).norm() < 1e-9);
                    }
                }
            }
            for (Operator x : ideals.get(a).basis()) {
                assertTrue(g.derived().contains(x));
            }
        }
        assertEquals(g.derived().dimension(), total);
    }
}
