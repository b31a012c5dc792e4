package org.liepath.integrators.internal;

/**
 * Nodes and coefficient tables of the exponential schemes (values verified by the order test in this module's
 * tests). Rows of a commutator-free table are exponentials in the order they act (row 0 acts first); columns are
 * the quadrature nodes.
 *
 * <p>Stateless static helpers: thread-safe.
 */
public final class Tables {
    private Tables() {
    }

    /** Two Gauss–Legendre nodes on [0, 1]: 1/2 ∓ √3/6. */
    public static final double[] GAUSS2 = {0.5 - Math.sqrt(3) / 6, 0.5 + Math.sqrt(3) / 6};
    /** Three Gauss–Legendre nodes on [0, 1]: 1/2 ∓ √15/10 and 1/2. */
    public static final double[] GAUSS3 = {0.5 - Math.sqrt(15) / 10, 0.5, 0.5 + Math.sqrt(15) / 10};
    /** Four Gauss–Legendre nodes on [0, 1]: 1/2 ∓ v1, 1/2 ∓ v2. */
    public static final double[] GAUSS4;
    /** The single midpoint node. */
    public static final double[] MIDPOINT = {0.5};

    static final double V1 = 0.5 * Math.sqrt((3 + 2 * Math.sqrt(6.0 / 5)) / 7);
    static final double V2 = 0.5 * Math.sqrt((3 - 2 * Math.sqrt(6.0 / 5)) / 7);

    static {
        GAUSS4 = new double[]{0.5 - V1, 0.5 - V2, 0.5 + V2, 0.5 + V1};
    }

    /** Exponential midpoint X ← exp(h A(t + h/2)) X. */
    public static final double[][] MIDPOINT_TABLE = {{1.0}};

    /**
     * CF4:2 on two Gauss nodes (S. Blanes, P.C. Moan, Appl. Numer. Math. 56 (2006) 1519–1537; M. Thalhammer, SIAM J.
     * Numer. Anal. 44 (2006) 851–864): a1 = 1/4 − √3/6, a2 = 1/4 + √3/6; the exponential favouring the earlier node
     * acts first.
     */
    public static final double[][] CF4_2 = {
        {0.25 + Math.sqrt(3) / 6, 0.25 - Math.sqrt(3) / 6},
        {0.25 - Math.sqrt(3) / 6, 0.25 + Math.sqrt(3) / 6}};

    private static final double R = Math.sqrt(5.0 / 3);

    /**
     * CF4:3Opt on three Gauss nodes, attributed to A. Alvermann, H. Fehske, J. Comput. Phys. 230 (2011) 5930–5956.
     * The values are from memory (not checked against the paper's table); they pass the fourth-order test.
     */
    public static final double[][] CF4_3OPT = {
        {37.0 / 240 + 10.0 / 87 * R, -1.0 / 30, 37.0 / 240 - 10.0 / 87 * R},
        {-11.0 / 360, 23.0 / 45, -11.0 / 360},
        {37.0 / 240 - 10.0 / 87 * R, -1.0 / 30, 37.0 / 240 + 10.0 / 87 * R}};

    /**
     * A sixth-order, six-exponential commutator-free table on three Gauss nodes (recalled as an optimised scheme of
     * the Alvermann–Fehske family; attribution unverified, order verified by the order test).
     */
    public static final double[][] CF6_6 = {
        {0.2158389969757678, -0.0767179645915514, 0.0208789676157837},
        {-0.0808977963208530, -0.1787472175371576, 0.0322633664310473},
        {0.1806284600558301, 0.4776874043509313, -0.0909342169797981},
        {-0.0909342169797981, 0.4776874043509313, 0.1806284600558301},
        {0.0322633664310473, -0.1787472175371576, -0.0808977963208530},
        {0.0208789676157837, -0.0767179645915514, 0.2158389969757678}};
}
