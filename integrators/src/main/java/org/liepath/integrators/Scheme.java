package org.liepath.integrators;

import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Lindbladian;
import org.liepath.core.internal.Require;
import org.liepath.integrators.internal.CommutatorFreeKernel;
import org.liepath.integrators.internal.Kernel;
import org.liepath.integrators.internal.LinearSystem;
import org.liepath.integrators.internal.MagnusKernel;
import org.liepath.integrators.internal.PiecewiseKernel;
import org.liepath.integrators.internal.Tables;

import java.util.Objects;

/**
 * A time-stepping scheme for X' = A(t) X: for a Hamiltonian A(t) = −iH(t) (Schrödinger, ħ = 1), for a GKLS generator
 * the Liouville-space generator (column stacking). A scheme holds algorithm choices only — no operator, no tolerance.
 *
 * <p>Every scheme declares its data, which the tests check: {@link #order()} (classical order of the propagated
 * result), {@link #nodes()} (evaluations of the generator per step), {@link #exponentialsPerStep()} and
 * {@link #commutatorsPerStep()} (for the fixed-step propagation, without the work of the error estimate), and
 * {@link #name()}.
 *
 * <p>Error estimates for adaptive runs: step doubling for every scheme with a step kernel, err = ‖X_{h/2∘h/2} −
 * X_h‖_F / ((2^p − 1)‖X_{h/2∘h/2}‖_F) (E. Hairer, S.P. Nørsett, G. Wanner, Solving Ordinary Differential Equations
 * I, Springer 1993, §II.4), which costs three steps' work per step. Embedded pairs sharing the Gauss nodes (the
 * fourth-order Magnus exponent inside Magnus 6; CF4:2 evaluated on three nodes beside CF4:3Opt and CF6) were
 * implemented first and dropped, for two measured reasons: (1) a partner on the same nodes shares the three-point
 * quadrature of ∫A, so its difference vanishes for a generator that commutes with itself (a single driven term)
 * and the run then leaves its tolerance by orders of magnitude; (2) with a quadrature check added to cure that, the
 * estimate is of a fourth-order error, and on a driven two-qubit problem at tolerance 1e-10 the embedded runs
 * needed 2.1× (CF4:3Opt), 2.3× (Magnus 6) and 3.9× (CF6) the exponentials of step doubling for a similar or larger
 * error. {@link #piecewiseExact()} needs no estimate (exact per segment).
 * The controller exponent is 1/(p+1).
 * The propagated result is always the higher-order one (local extrapolation), so every exponential factor stays in
 * the group (unitary for a Hamiltonian).
 *
 * <p>Immutable and thread-safe. Instances are cheap constants.
 */
public final class Scheme {
    enum Kind { MIDPOINT, MAGNUS4, MAGNUS6, MAGNUS8, CF4, CF4_OPT, CF6, PIECEWISE, REFERENCE, WEI_NORMAN }

    private static final Scheme MIDPOINT = new Scheme(Kind.MIDPOINT, "exponential midpoint", 2, 1, 1, 0, null);
    private static final Scheme MAGNUS4 = new Scheme(Kind.MAGNUS4, "Magnus 4 (2 Gauss nodes)", 4, 2, 1, 1, null);
    private static final Scheme MAGNUS6 = new Scheme(Kind.MAGNUS6, "Magnus 6 (3 Gauss nodes, BCR)", 6, 3, 1, 3, null);
    private static final Scheme MAGNUS8 = new Scheme(Kind.MAGNUS8, "Magnus 8 (4 Gauss nodes, BCR)", 8, 4, 1, 10, null);
    private static final Scheme CF4 = new Scheme(Kind.CF4, "CF4:2", 4, 2, 2, 0, null);
    private static final Scheme CF4_OPT = new Scheme(Kind.CF4_OPT, "CF4:3Opt", 4, 3, 3, 0, null);
    private static final Scheme CF6 = new Scheme(Kind.CF6, "CF6 (six exponentials, 3 Gauss nodes)", 6, 3, 6, 0,
            null);
    private static final Scheme PIECEWISE = new Scheme(Kind.PIECEWISE, "piecewise exact", Integer.MAX_VALUE, 1, 1, 0,
            null);
    private static final Scheme REFERENCE = new Scheme(Kind.REFERENCE, "reference (Dormand–Prince 8(5,3))", 8, 12, 0,
            0, null);

    final Kind kind;
    private final String name;
    private final int order, nodes, exps, comms;
    final WeiNorman chart;
    /** Whether steps are taken in the interaction picture of the static part ({@link #inInteractionPicture()}). */
    final boolean interaction;

    private Scheme(Kind kind, String name, int order, int nodes, int exps, int comms, WeiNorman chart) {
        this(kind, name, order, nodes, exps, comms, chart, false);
    }

    private Scheme(Kind kind, String name, int order, int nodes, int exps, int comms, WeiNorman chart,
                   boolean interaction) {
        this.interaction = interaction;
        this.kind = kind;
        this.name = name;
        this.order = order;
        this.nodes = nodes;
        this.exps = exps;
        this.comms = comms;
        this.chart = chart;
    }

    /**
     * Exponential midpoint rule X ← exp(h A(t + h/2)) X: order 2, one evaluation, one exponential; time symmetric.
     *
     * @return the scheme
     */
    public static Scheme exponentialMidpoint() {
        return MIDPOINT;
    }

    /**
     * Fourth-order Magnus integrator on two Gauss–Legendre nodes with one commutator,
     * Ω = (h/2)(A_1 + A_2) − (√3/12) h² [A_1, A_2] (A. Iserles, S.P. Nørsett, Phil. Trans. R. Soc. A 357 (1999)
     * 983–1019; S. Blanes, F. Casas, J.A. Oteo, J. Ros, Phys. Rep. 470 (2009) 151–238).
     *
     * @return the scheme
     */
    public static Scheme magnus4() {
        return MAGNUS4;
    }

    /**
     * Sixth-order Magnus integrator on three Gauss nodes with three commutators (S. Blanes, F. Casas, J. Ros, BIT 40
     * (2000) 434–450).
     *
     * @return the scheme
     */
    public static Scheme magnus6() {
        return MAGNUS6;
    }

    /**
     * Eighth-order Magnus integrator on four Gauss nodes with ten commutators (S. Blanes, F. Casas, J. Ros, BIT 40
     * (2000) 434–450, in the form built on univariate integrals).
     *
     * @return the scheme
     */
    public static Scheme magnus8() {
        return MAGNUS8;
    }

    /**
     * CF4:2, the fourth-order commutator-free scheme with two exponentials on two Gauss nodes (S. Blanes, P.C. Moan,
     * Appl. Numer. Math. 56 (2006) 1519–1537; M. Thalhammer, SIAM J. Numer. Anal. 44 (2006) 851–864).
     *
     * @return the scheme
     */
    public static Scheme commutatorFree4() {
        return CF4;
    }

    /**
     * CF4:3Opt, a fourth-order commutator-free scheme with three exponentials on three Gauss nodes, attributed to
     * A. Alvermann, H. Fehske, J. Comput. Phys. 230 (2011) 5930–5956. <b>Its coefficient values are from memory</b>:
     * they are verified to give order 4 (with an error constant far below CF4:2's), but were not checked against the
     * paper's table. The default scheme of {@link Evolve}.
     *
     * @return the scheme
     */
    public static Scheme commutatorFree4Opt() {
        return CF4_OPT;
    }

    /**
     * A sixth-order commutator-free scheme with six exponentials on three Gauss nodes (an optimised table recalled
     * from the Alvermann–Fehske family of schemes; the attribution is unverified, the order is verified).
     *
     * @return a sixth-order commutator-free scheme with six exponentials on three Gauss nodes
     *     recalled from the Alvermann–Fehske family of schemes
     */
    public static Scheme commutatorFree6() {
        return CF6;
    }

    /**
     * Exact stepping for piecewise-constant Hamiltonians: one exponential exp(−i Δt H) per constant segment (long
     * segments are cut into a few pieces to keep the exponential unitary to rounding). {@link #order()} is
     * {@link Integer#MAX_VALUE} (exact). A run refuses a Hamiltonian whose drives are not all piecewise constant.
     *
     * @return the scheme
     */
    public static Scheme piecewiseExact() {
        return PIECEWISE;
    }

    /**
     * The reference integrator for validation: Apache Commons Math's Dormand–Prince 8(5,3) on the real vectorised
     * equation, with absolute and relative tolerance equal to the run's tolerance. It is <b>not</b> structure
     * preserving: its unitarity (or trace) drift is visible in results. Adaptive only (a run with fixed steps is
     * refused); no stepper. {@link #nodes()} counts its 12 stages per step; rejected steps are not reported.
     *
     * @return the reference integrator for validation
     */
    public static Scheme reference() {
        return REFERENCE;
    }

    /**
     * Integration in Wei–Norman coordinates of the given chart: the run integrates the chart's coordinate equations
     * (the chart re-anchors itself when it turns singular) and returns the propagator in the chart's representation
     * and {@link Evolution#coordinates()}. Adaptive only; Hamiltonians only. {@link #order()} is 0 here (the accuracy
     * is set by the tolerance of the chart's own integrator).
     *
     * @param chart the Wei–Norman chart
     * @return the scheme
     */
    public static Scheme weiNorman(WeiNorman chart) {
        Require.nonNull(chart, "chart");
        return new Scheme(Kind.WEI_NORMAN, "Wei–Norman", 0, 0, 0, 0, chart);
    }

    /**
     * The same scheme applied in the interaction picture of the Hamiltonian's static part: for
     * H(t) = H_0 + Σ c_k(t) A_k, with H_0 the sum of the terms whose drive is constant, each step [t, t+h] is taken
     * in the frame that rotates with H_0 about the step's midpoint τ, where the Hamiltonian is
     * H_I(s) = e^{iH_0(s−τ)} H_1(s) e^{−iH_0(s−τ)}, and returned to the laboratory frame exactly:
     * U(t+h, t) = e^{−iH_0h/2} U_I e^{−iH_0h/2}. The frame is exact, so the order, nodes, exponentials and
     * commutators per step stay those of this scheme, and so does unitarity by construction (the frame's factors are
     * diagonal phases in the eigenbasis of H_0). What changes is the error constant: it no longer contains H_0, so a
     * strong static part with weak drives (level energies plus control fields) needs far fewer steps for the same
     * accuracy. With the drives resonant with a two-level H_0 the exactly solvable rotating-drive problem becomes
     * time independent in this frame and a single step is exact.
     *
     * <p>Cost beyond this scheme: O(m²) per step for the frame's phases (m sines and cosines, the node phases cached
     * per step size). When H_0 is not diagonal in the Hamiltonian's basis it is diagonalised once per run or stepper,
     * and the state crosses into the frame once per run and out of it once per sample (one m×m product each, m×1 for
     * a state). A Hamiltonian without a constant-drive term has nothing to rotate away: the steps are then this
     * scheme's own.
     *
     * <p>Available for the single-exponential schemes: {@link #exponentialMidpoint()} (which then becomes the
     * symmetric splitting e^{−iH_0h/2} e^{−ihH_1(τ)} e^{−iH_0h/2}) and the Magnus schemes. Not for the
     * commutator-free products of several exponentials: they would run (every factor's exponent takes the same
     * diagonal conjugation; measured orders 4 and 6), but their error in the frame was 2–5× larger at equal steps on
     * a driven three-level system and 5–75× larger on a 16-level system with a strong static part than without the
     * frame, because the node values they do not couple by commutators rotate at the frame's frequencies; refusing
     * them keeps the frame an improvement wherever it is offered. Not either for exact piecewise-constant stepping,
     * the reference integrator or Wei–Norman coordinates, and only for Hamiltonians (an evolution or stepper of a
     * {@link Lindbladian} with such a scheme is refused).
     *
     * @return the scheme in the interaction picture (this scheme if it already is)
     * @throws InvalidInputException UNSUPPORTED for the schemes named above
     */
    public Scheme inInteractionPicture() {
        if (interaction) {
            return this;
        }
        if (kind != Kind.MIDPOINT && kind != Kind.MAGNUS4 && kind != Kind.MAGNUS6 && kind != Kind.MAGNUS8) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "scheme",
                    "the exponential midpoint rule or a Magnus scheme (one exponential per step)", name);
        }
        return new Scheme(kind, name + ", interaction picture", order, nodes, exps, comms, chart, true);
    }

    /** @return whether steps are taken in the interaction picture of the static part ({@link #inInteractionPicture}) */
    public boolean isInteractionPicture() {
        return interaction;
    }

    /** @return the classical order of the propagated result ({@link Integer#MAX_VALUE} for exact stepping) */
    public int order() {
        return order;
    }

    /** @return evaluations of the generator (Hamiltonian) per fixed step (an adaptive step costs three steps) */
    public int nodes() {
        return nodes;
    }

    /** @return matrix exponentials per fixed step */
    public int exponentialsPerStep() {
        return exps;
    }

    /** @return commutators per fixed step */
    public int commutatorsPerStep() {
        return comms;
    }

    /** @return a short human-readable name */
    public String name() {
        return name;
    }

    /**
     * A zero-allocation stepper for this scheme and Hamiltonian (see {@link Stepper}).
     *
     * @param h the Hamiltonian
     * @return a zero-allocation stepper for this scheme and Hamiltonian (see {@link Stepper})
     * @throws InvalidInputException UNSUPPORTED for {@link #reference()} and Wei–Norman schemes, and for
     *                               {@link #piecewiseExact()} with drives that are not piecewise constant
     */
    public Stepper stepper(Hamiltonian h) {
        Require.nonNull(h, "h");
        requireStepping("h", h.isPiecewiseConstant());
        return new Stepper(this, kernel(system(h)), h.dim(), false);
    }

    /**
     * A zero-allocation stepper in Liouville space for a GKLS generator (see {@link Stepper}); the state is vec(ρ)
     * (column stacking) or the n²×n² dynamical map.
     *
     * @param l the GKLS generator
     * @return a zero-allocation stepper in Liouville space for a GKLS generator (see {@link Stepper})
     */
    public Stepper stepper(Lindbladian l) {
        Require.nonNull(l, "l");
        requireStepping("l", l.hamiltonian().isPiecewiseConstant());
        requireHamiltonian("l");
        return new Stepper(this, kernel(LinearSystem.of(l)), l.dim() * l.dim(), true);
    }

    private void requireStepping(String arg, boolean piecewiseConstant) {
        if (kind == Kind.REFERENCE || kind == Kind.WEI_NORMAN) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, "scheme", "a scheme with a fixed-step kernel",
                    name + " (adaptive only, no stepper)");
        }
        requirePiecewise(arg, piecewiseConstant);
    }

    /** Refuses an open system for a scheme in the interaction picture. */
    void requireHamiltonian(String arg) {
        if (interaction) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, arg,
                    "a Hamiltonian for a scheme in the interaction picture (" + name + ")", "a Lindbladian");
        }
    }

    /** The system this scheme steps for a Hamiltonian: in the interaction picture of its static part if asked. */
    LinearSystem system(Hamiltonian h) {
        return interaction ? LinearSystem.interaction(h) : LinearSystem.of(h);
    }

    void requirePiecewise(String arg, boolean piecewiseConstant) {
        if (kind == Kind.PIECEWISE && !piecewiseConstant) {
            throw InvalidInputException.of(Reason.UNSUPPORTED, arg,
                    "a Hamiltonian whose drives are all piecewise constant (scheme " + name + ")",
                    "a drive that is not piecewise constant");
        }
    }

    /** The step kernel of this scheme on a system (not for reference or Wei–Norman). */
    Kernel kernel(LinearSystem sys) {
        switch (kind) {
            case MIDPOINT:
                return new CommutatorFreeKernel(sys, Tables.MIDPOINT, Tables.MIDPOINT_TABLE, 2);
            case MAGNUS4:
                return new MagnusKernel(sys, 4);
            case MAGNUS6:
                return new MagnusKernel(sys, 6);
            case MAGNUS8:
                return new MagnusKernel(sys, 8);
            case CF4:
                return new CommutatorFreeKernel(sys, Tables.GAUSS2, Tables.CF4_2, 4);
            case CF4_OPT:
                return new CommutatorFreeKernel(sys, Tables.GAUSS3, Tables.CF4_3OPT, 4);
            case CF6:
                return new CommutatorFreeKernel(sys, Tables.GAUSS3, Tables.CF6_6, 6);
            case PIECEWISE:
                return new PiecewiseKernel(sys);
            default:
                throw new IllegalStateException("no kernel for " + name);
        }
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Scheme && ((Scheme) o).kind == kind && ((Scheme) o).interaction == interaction
                && Objects.equals(((Scheme) o).chart, chart);
    }

    @Override
    public int hashCode() {
        return (kind.hashCode() * 31 + Objects.hashCode(chart)) * 2 + (interaction ? 1 : 0);
    }

    @Override
    public String toString() {
        return name + " (order " + (order == Integer.MAX_VALUE ? "exact" : String.valueOf(order)) + ", " + nodes
                + " nodes, " + exps + " exponentials, " + commutators() + " commutators per step)";
    }

    private int commutators() {
        return comms;
    }
}
