package org.liepath.integrators;

import java.util.List;
import java.util.function.Supplier;
import java.util.stream.Stream;

/**
 * The schemes under test with their published orders and the per-scheme budgets of the contract suite.
 *
 * <p>Orders: exponential midpoint 2; fourth-order Magnus with two Gauss nodes (A. Iserles, S. P. Nørsett, Phil.
 * Trans. R. Soc. A 357, 983 (1999)); sixth- and eighth-order Magnus (S. Blanes, F. Casas, J. Ros, BIT 40, 434
 * (2000)); commutator-free CF4:2 (S. Blanes, P. C. Moan, Appl. Numer. Math. 56, 1519 (2006); M. Thalhammer, SIAM J.
 * Numer. Anal. 44, 851 (2006)); CF4:3Opt and the sixth-order commutator-free scheme (A. Alvermann, H. Fehske,
 * J. Comput. Phys. 230, 5930 (2011)); Dormand–Prince 8(5,3) (E. Hairer, S. P. Nørsett, G. Wanner, Solving Ordinary
 * Differential Equations I, Springer 1993, §II.5).
 */
final class SchemeCases {
    private SchemeCases() {
    }

    /**
     * One scheme of the contract suite.
     *
     * @param order        the published order of the method
     * @param fixedStep    whether the scheme runs with a fixed step count (false: adaptive only)
     * @param exactPiecewise whether the scheme is only meant for piecewise-constant Hamiltonians
     */
    record Case(String name, Supplier<Scheme> scheme, int order, boolean fixedStep, boolean exactPiecewise) {
        Scheme get() {
            return scheme.get();
        }

        @Override
        public String toString() {
            return name;
        }
    }

    static final Case MIDPOINT = new Case("exponentialMidpoint", Scheme::exponentialMidpoint, 2, true, false);
    static final Case MAGNUS4 = new Case("magnus4", Scheme::magnus4, 4, true, false);
    static final Case MAGNUS6 = new Case("magnus6", Scheme::magnus6, 6, true, false);
    static final Case MAGNUS8 = new Case("magnus8", Scheme::magnus8, 8, true, false);
    static final Case CF4 = new Case("commutatorFree4", Scheme::commutatorFree4, 4, true, false);
    static final Case CF4OPT = new Case("commutatorFree4Opt", Scheme::commutatorFree4Opt, 4, true, false);
    static final Case CF6 = new Case("commutatorFree6", Scheme::commutatorFree6, 6, true, false);
    static final Case PIECEWISE = new Case("piecewiseExact", Scheme::piecewiseExact, 0, true, true);
    static final Case REFERENCE = new Case("reference", Scheme::reference, 8, false, false);

    /** The single-exponential schemes in the interaction picture of the static part (same orders: the frame is exact). */
    static final Case MIDPOINT_IP = new Case("exponentialMidpoint/interaction",
            () -> Scheme.exponentialMidpoint().inInteractionPicture(), 2, true, false);
    static final Case MAGNUS4_IP = new Case("magnus4/interaction", () -> Scheme.magnus4().inInteractionPicture(), 4,
            true, false);
    static final Case MAGNUS6_IP = new Case("magnus6/interaction", () -> Scheme.magnus6().inInteractionPicture(), 6,
            true, false);
    static final Case MAGNUS8_IP = new Case("magnus8/interaction", () -> Scheme.magnus8().inInteractionPicture(), 8,
            true, false);

    /** The exponential (Lie-group) schemes for smooth drives. */
    static final List<Case> LIE_GROUP = List.of(MIDPOINT, MAGNUS4, MAGNUS6, MAGNUS8, CF4, CF4OPT, CF6, MIDPOINT_IP,
            MAGNUS4_IP, MAGNUS6_IP, MAGNUS8_IP);

    static Stream<Case> lieGroup() {
        return LIE_GROUP.stream();
    }

    static Stream<Case> all() {
        return Stream.concat(LIE_GROUP.stream(), Stream.of(PIECEWISE, REFERENCE));
    }

    static Stream<Case> smooth() {
        return Stream.concat(LIE_GROUP.stream(), Stream.of(REFERENCE));
    }
}
