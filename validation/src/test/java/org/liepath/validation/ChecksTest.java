package org.liepath.validation;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Operator;
import org.liepath.core.Superoperator;
import org.liepath.testing.Seeds;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ChecksTest {

    /**
     * exp(−iH) of a Hermitian H is unitary (common practice: exponential of an anti-Hermitian matrix); rounding of the
     * eigen-based exponential stays ~n·ε. A perturbation U + δE moves U†U − I by δ(U†E + E†U) + O(δ²), i.e. by
     * order δ‖E‖ — detected well above the tolerance.
     */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void exactExponentialsAreUnitaryPerturbedAreNot(long seed) {
        Random r = new Random(seed);
        int n = 1 + r.nextInt(8);
        Operator u = Seeds.randomHermitian(r, n).expMinusI(0.1 + 3 * r.nextDouble());
        assertTrue(Checks.unitarityError(u) < 1e-13, "error " + Checks.unitarityError(u));
        assertTrue(Checks.isUnitary(u));
        Operator e = Seeds.randomMatrix(r, n);
        Operator p = u.plus(e.scale(1e-6 / e.norm()));
        double err = Checks.unitarityError(p);
        // ‖U†E + E†U‖_F ≤ 2‖E‖_F = 2e-6 and is ≥ 1e-8 for a generic direction
        assertTrue(err > 1e-9 && err < 2.1e-6, "perturbed error " + err);
        assertFalse(Checks.isUnitary(p));
        assertTrue(Checks.isUnitary(p, 1e-5));
    }

    /** ‖(2I)†(2I) − I‖_F = 3√n exactly. */
    @Test
    void scaledIdentityUnitarityError() {
        assertEquals(3 * Math.sqrt(3), Checks.unitarityError(Operator.identity(3).scale(2)), 1e-15);
    }

    /**
     * Amplitude damping (Kraus form, Nielsen & Chuang §8.3.5) is completely positive and trace preserving; its Choi
     * matrix has rank 2, so λ_min = 0 (rounding only).
     */
    @ParameterizedTest
    @ValueSource(doubles = {0.0, 0.1, 0.5, 0.9, 1.0})
    void amplitudeDampingIsCptp(double gamma) {
        Superoperator ad = Superoperator.kraus(Channels.amplitudeDampingKraus(gamma));
        assertEquals(0, Checks.choiMinEigenvalue(ad), 1e-14);
        assertTrue(Checks.isCompletelyPositive(ad));
        assertEquals(0, Checks.traceError(ad), 1e-15);
        assertTrue(Checks.isTracePreserving(ad));
        assertTrue(Checks.isHermiticityPreserving(ad));
    }

    /**
     * The transpose map is positive but not completely positive (Choi 1975; common textbook example): its
     * unnormalised Choi matrix is the swap operator on ℂⁿ ⊗ ℂⁿ with eigenvalues +1 (symmetric) and −1
     * (antisymmetric), so λ_min = −1 (−1/n for the normalised Choi state, −1/2 for a qubit).
     */
    @ParameterizedTest
    @ValueSource(ints = {2, 3, 4})
    void transposeIsNotCompletelyPositive(int n) {
        Superoperator t = Channels.transpose(n);
        assertEquals(-1.0, Checks.choiMinEigenvalue(t), 1e-13);
        assertFalse(Checks.isCompletelyPositive(t));
        assertEquals(0, Checks.traceError(t), 1e-15);
        assertTrue(Checks.isHermiticityPreserving(t));
    }

    /** ρ ↦ 0.9ρ loses 10% of the trace: tr E(|a⟩⟨a|) − 1 = −0.1. */
    @Test
    void nonTracePreservingMap() {
        Superoperator shrink = Superoperator.kraus(List.of(Operator.identity(2).scale(Math.sqrt(0.9))));
        assertEquals(0.1, Checks.traceError(shrink), 1e-15);
        assertFalse(Checks.isTracePreserving(shrink));
        assertTrue(Checks.isCompletelyPositive(shrink));
    }

    /**
     * X ↦ iX does not preserve Hermiticity: J = i J_id with J_id = |Ω⟩⟨Ω| Hermitian (‖J_id‖_F = n), so
     * ‖J − J†‖_F = 2n.
     */
    @Test
    void hermiticityError() {
        Superoperator s = Superoperator.identity(3).compose(Superoperator.ofMatrix(Operator.identity(9).scale(new Complex(0, 1))));
        assertEquals(6, Checks.hermiticityError(s), 1e-14);
        assertFalse(Checks.isHermiticityPreserving(s));
    }

    /** Random Stinespring channels are CPTP (λ_min(J) ≥ −rounding, trace defect at rounding level). */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void randomChannelsAreCptp(long seed) {
        Random r = new Random(seed);
        Superoperator s = Superoperator.kraus(Channels.randomKraus(r, 2 + r.nextInt(2), 2 + r.nextInt(2)));
        assertTrue(Checks.isCompletelyPositive(s), "λ_min = " + Checks.choiMinEigenvalue(s));
        assertTrue(Checks.isTracePreserving(s), "trace error " + Checks.traceError(s));
        assertTrue(Checks.isHermiticityPreserving(s));
    }

    @Test
    void badInput() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> Checks.unitarityError(null));
        assertEquals(InvalidInputException.Reason.NULL, e.reason());
        assertTrue(e.getMessage().contains("u"));
        InvalidInputException t = assertThrows(InvalidInputException.class,
                () -> Checks.isUnitary(Operator.identity(2), -1));
        assertEquals(InvalidInputException.Reason.OUT_OF_RANGE, t.reason());
        assertTrue(t.getMessage().contains("tol") && t.getMessage().contains("-1"), t.getMessage());
        assertThrows(InvalidInputException.class, () -> Checks.choiMinEigenvalue(null));
        assertThrows(InvalidInputException.class, () -> Checks.traceError(null));
    }
}
