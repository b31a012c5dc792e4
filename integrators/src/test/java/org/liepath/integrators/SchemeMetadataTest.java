package org.liepath.integrators;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.InvalidInputException;

import java.util.HashSet;
import java.util.List;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The declared data of every scheme, checked against what a run actually does. */
class SchemeMetadataTest {
    static List<Scheme> schemes() {
        return Fixtures.steppable();
    }

    /** Declared orders, as published for each method (sources in the Scheme Javadoc). */
    @Test
    void declaredOrders() {
        assertEquals(2, Scheme.exponentialMidpoint().order());
        assertEquals(4, Scheme.magnus4().order());
        assertEquals(6, Scheme.magnus6().order());
        assertEquals(8, Scheme.magnus8().order());
        assertEquals(4, Scheme.commutatorFree4().order());
        assertEquals(4, Scheme.commutatorFree4Opt().order());
        assertEquals(6, Scheme.commutatorFree6().order());
        assertEquals(Integer.MAX_VALUE, Scheme.piecewiseExact().order());
        assertEquals(8, Scheme.reference().order());
    }

    /** Evaluations, exponentials and commutators per fixed step are what the scheme declares. */
    @ParameterizedTest(name = "{0}")
    @MethodSource("schemes")
    void workPerStepMatchesDeclaration(Scheme s) {
        int steps = 13;
        Stats st = Evolve.of(Fixtures.drivenQubit()).over(0, 1).scheme(s).steps(steps).run().stats();
        assertEquals(steps, st.acceptedSteps());
        assertEquals((long) s.nodes() * steps, st.evaluations(), "evaluations");
        assertEquals((long) s.exponentialsPerStep() * steps, st.exponentials(), "exponentials");
        assertEquals((long) s.commutatorsPerStep() * steps, st.commutators(), "commutators");
    }

    @Test
    void namesAreDistinctAndSchemesAreConstants() {
        Set<String> names = new HashSet<>();
        for (Scheme s : Fixtures.schemes()) {
            assertFalse(s.name().isEmpty());
            assertTrue(names.add(s.name()), "duplicate name " + s.name());
            assertTrue(s.toString().contains(s.name()));
        }
        assertSame(Scheme.magnus4(), Scheme.magnus4());
        assertEquals("CF4:3Opt", Scheme.commutatorFree4Opt().name());
        assertFalse(Scheme.commutatorFree6().name().contains("CF6:5"), "the six-exponential table is no CF6:5Opt");
    }

    @Test
    void weiNormanNeedsAChart() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> Scheme.weiNorman(null));
        assertEquals(InvalidInputException.Reason.NULL, e.reason());
        assertTrue(e.getMessage().contains("chart"));
    }

    @Test
    void defaultSchemeIsCommutatorFree4Opt() {
        Evolution ev = Evolve.of(Fixtures.drivenQubit()).over(0, 1).run();
        assertSame(Scheme.commutatorFree4Opt(), ev.scheme());
        assertTrue(Double.isFinite(ev.errorEstimate()), "default runs are adaptive");
    }
}
