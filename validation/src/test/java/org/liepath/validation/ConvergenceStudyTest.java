package org.liepath.validation;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.integrators.Scheme;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ConvergenceStudyTest {

    /** A synthetic method whose error is exactly C·hᵖ: the fit must return p (least squares on exact powers). */
    @Test
    void exactPowerLawGivesItsExponent() {
        Operator ref = Operator.identity(2);
        Operator dir = Pauli.x();
        ConvergenceStudy s = ConvergenceStudy.of("h^3", n -> ref.plus(dir.scale(Math.pow(1.0 / n, 3))), ref)
                .steps(4, 6).run();
        assertEquals(3.0, s.observedOrder(), 1e-12);
        assertArrayEquals(new int[]{0, 5}, s.fittedRange());
        assertEquals(6, s.points().size());
        assertEquals(128, s.points().get(5).steps());
        assertTrue(s.toString().contains("observed order 3.00"), s.toString());
        assertEquals(7, s.toCsv().split("\n").length);
    }

    /** Points below the noise floor (rounding) are left out of the fit. */
    @Test
    void noiseFloorIsExcluded() {
        Operator ref = Operator.identity(2);
        ConvergenceStudy s = ConvergenceStudy.of("floor", n -> ref.plus(Pauli.z().scale(Math.max(Math.pow(1.0 / n, 4), 1e-15))), ref)
                .steps(2, 10).run();
        // errors √2·h⁴ fall below 1e-12·√2 at h = 1e-3: steps 2 … 512 usable (indices 0 … 8), 1024 not
        assertEquals(4.0, s.observedOrder(), 1e-9);
        assertArrayEquals(new int[]{0, 8}, s.fittedRange());
    }

    /** A pre-asymptotic coarse point whose local slope differs from the settled ones is not fitted. */
    @Test
    void preAsymptoticPointIsExcluded() {
        Operator ref = Operator.identity(2);
        double[] errors = {0.5, 1e-2, 1.25e-3, 1.5625e-4, 1.953125e-5};  // slopes ≈ 5.6, then exactly 3
        ConvergenceStudy s = ConvergenceStudy.of("bend", n -> ref.plus(Pauli.z().scale(errors[Integer.numberOfTrailingZeros(n)] / Math.sqrt(2))), ref)
                .steps(1, 5).run();
        assertArrayEquals(new int[]{1, 4}, s.fittedRange());
        assertEquals(3.0, s.observedOrder(), 1e-9);
    }

    /** Failed runs (null results) are unusable points; all failed: no order. */
    @Test
    void failedRunsGiveNoOrder() {
        ConvergenceStudy s = ConvergenceStudy.of("fails", n -> null, Operator.identity(2)).steps(2, 3).run();
        assertFalse(s.isResolved());
        assertTrue(Double.isNaN(s.observedOrder()));
        assertEquals(0, s.fittedRange().length);
    }

    static Stream<Object[]> schemes() {
        // declared orders: exponential midpoint 2; Magnus 4 with 2 Gauss nodes (A. Iserles, S.P. Nørsett, Phil. Trans.
        // R. Soc. A 357 (1999) 983); Magnus 6 (S. Blanes, F. Casas, J. Ros, BIT 40 (2000) 434); CF4:3Opt
        // (A. Alvermann, H. Fehske, J. Comput. Phys. 230 (2011) 5930)
        return Stream.of(new Object[]{Scheme.exponentialMidpoint(), 2.0}, new Object[]{Scheme.magnus4(), 4.0},
                new Object[]{Scheme.commutatorFree4Opt(), 4.0}, new Object[]{Scheme.magnus6(), 6.0});
    }

    /**
     * The observed order of the integrators' schemes on the two-level problem H = ½σz + ½ cos(t) σx over [0, 2]
     * matches the published order to ±0.25 (the asymptotic regime of global error C·hᵖ; a next-order term shifts
     * the fitted slope by O(h)).
     */
    @ParameterizedTest
    @MethodSource("schemes")
    void schemesShowTheirPublishedOrder(Scheme scheme, double order) {
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), Drive.cosine(0.5, 1.0)).build();
        ConvergenceStudy s = ConvergenceStudy.of(h, 0, 2, scheme).steps(4, 5).run();
        assertTrue(s.isResolved(), s.toString());
        assertEquals(order, s.observedOrder(), 0.25, s.toString());
        assertTrue(s.points().get(0).evaluations() > 0);
    }

    @Test
    void badInput() {
        var b = ConvergenceStudy.of("x", n -> Operator.identity(2), Operator.identity(2));
        InvalidInputException lv = assertThrows(InvalidInputException.class, () -> b.steps(4, 1));
        assertEquals(InvalidInputException.Reason.OUT_OF_RANGE, lv.reason());
        assertTrue(lv.getMessage().contains("levels") && lv.getMessage().contains("1"), lv.getMessage());
        assertThrows(InvalidInputException.class, () -> b.steps(4, 21));
        InvalidInputException st = assertThrows(InvalidInputException.class, () -> b.steps(0, 4));
        assertTrue(st.getMessage().contains("startSteps") && st.getMessage().contains("0"));
        assertThrows(InvalidInputException.class, () -> b.steps(1 << 20, 15));
        InvalidInputException dim = assertThrows(InvalidInputException.class,
                () -> ConvergenceStudy.of("x", n -> Operator.identity(3), Operator.identity(2)).steps(2, 2).run());
        assertEquals(InvalidInputException.Reason.DIMENSION_MISMATCH, dim.reason());
        assertThrows(InvalidInputException.class, () -> b.span(0));
        assertThrows(InvalidInputException.class, () -> ConvergenceStudy.of("x", n -> null, null));
    }
}
