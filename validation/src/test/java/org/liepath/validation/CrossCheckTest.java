package org.liepath.validation;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.Superoperator;
import org.liepath.integrators.Scheme;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class CrossCheckTest {

    /**
     * Rabi problem with a rotating drive, H = (ω0/2)σz + (Ω/2)(cos ωt σx + sin ωt σy), exact
     * U = exp(−iωtσz/2) exp(−it[(ω0−ω)/2 σz + (Ω/2)σx]) (I.I. Rabi, Phys. Rev. 51 (1937) 652; in the convention of
     * C.J. Foot, Atomic Physics, OUP 2005, eqs. 7.41–7.46), case ω0 = 1, Ω = 0.3, ω = 0.9, t = 10 with U00 =
     * 0.3112857498591961 + 0.05654599136014268i (computed independently, mpmath 30 digits).
     */
    @Test
    void rabiProblemAgainstExactPropagator(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        double w0 = 1, om = 0.3, w = 0.9, t = 10;
        Hamiltonian h = Hamiltonian.builder(2).term(w0 / 2, Pauli.z()).term(Pauli.x(), Drive.cosine(om / 2, w))
                .term(Pauli.y(), Drive.sine(om / 2, w, 0)).build();
        Operator exact = Pauli.z().expMinusI(w * t / 2)
                .times(Pauli.z().scale((w0 - w) / 2).plus(Pauli.x().scale(om / 2)).expMinusI(t));
        assertEquals(0, exact.get(0, 0).subtract(new Complex(0.3112857498591961, 0.05654599136014268)).abs(), 1e-14);
        CrossCheck cc = CrossCheck.of(h).over(0, t).scheme(Scheme.magnus4(), 200).scheme(Scheme.commutatorFree4Opt())
                .tolerance(1e-10).reference(exact).run();
        List<CrossCheck.Row> rows = cc.rows();
        assertEquals(3, rows.size());
        // Magnus 4 global error C h⁴ with h = 0.05, ‖H‖ ≈ 0.5: well below 1e-6
        assertTrue(rows.get(1).error() < 1e-6, cc.toString());
        assertEquals(200, rows.get(1).steps());
        assertEquals(400, rows.get(1).evaluations());    // two Gauss nodes per step
        assertTrue(rows.get(1).structureError() < 1e-13, cc.toString());
        // adaptive at 1e-10 per step: a global error of a few 1e-9 at most over ~100 steps
        assertTrue(rows.get(2).error() < 1e-8, cc.toString());
        String csv = cc.toCsv();
        String[] lines = csv.split("\n");
        assertEquals(4, lines.length);
        assertEquals(8, lines[0].split(",").length);
        assertTrue(lines[2].startsWith("Magnus 4"), csv);
        assertTrue(cc.toString().contains("error vs reference"));
        assertTrue(cc.toMarkdown().startsWith("| scheme |"));
        Path f = dir.resolve("sub/cc.csv");
        cc.writeCsv(f);
        assertEquals(csv, Files.readString(f));
    }

    /** Against the reference integrator: the reference row comes first and schemes agree with it. */
    @Test
    void defaultReferenceIntegrator() {
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), t -> 0.5 * t).build();
        int[] calls = {0};
        CrossCheck cc = CrossCheck.of(h).over(0, 1).scheme(Scheme.magnus6(), 16).scheme(Scheme.exponentialMidpoint(), 16)
                .monitor((f, c) -> { calls[0]++; return true; }).run();
        assertEquals(3, cc.rows().size());
        assertTrue(cc.rows().get(0).scheme().toLowerCase().contains("reference") || cc.rows().get(0).mode().contains("tol"));
        assertTrue(cc.rows().get(1).error() < 1e-10, cc.toString());
        assertTrue(cc.rows().get(2).error() > 1e-5, cc.toString());   // second order: ~2e-4 at h = 1/16
        assertEquals(2, calls[0]);
        CrossCheck cancelled = CrossCheck.of(h).over(0, 1).scheme(Scheme.magnus4(), 4).scheme(Scheme.magnus6(), 4)
                .monitor((f, c) -> false).run();
        assertEquals(2, cancelled.rows().size());
    }

    /**
     * Amplitude damping L = √Γ|0⟩⟨1|, H = 0: the channel is the Kraus map with γ = 1 − e^{−Γt} (M.A. Nielsen,
     * I.L. Chuang, CUP 2000, §8.3.5); the open-system cross-check reports the trace error as structure column.
     */
    @Test
    void lindbladianChannel() {
        double gamma = 0.7, t = 1.5;
        Lindbladian l = Lindbladian.builder(Hamiltonian.constant(Operator.zero(2)))
                .jump(gamma, Operator.unit(2, 0, 1)).build();
        Superoperator exact = Superoperator.kraus(Channels.amplitudeDampingKraus(1 - Math.exp(-gamma * t)));
        CrossCheck cc = CrossCheck.of(l).over(0, t).scheme(Scheme.magnus4(), 20).reference(exact.matrix()).run();
        assertTrue(cc.rows().get(1).error() < 1e-12, cc.toString());   // constant generator: stepped exactly
        assertTrue(cc.rows().get(1).structureError() < 1e-13);
        assertTrue(cc.toString().contains("trace error"));
    }

    @Test
    void badInput() {
        Hamiltonian h = Hamiltonian.constant(Pauli.z());
        InvalidInputException none = assertThrows(InvalidInputException.class,
                () -> CrossCheck.of(h).over(0, 1).run());
        assertEquals(InvalidInputException.Reason.EMPTY, none.reason());
        assertTrue(none.getMessage().contains("schemes"));
        InvalidInputException noInterval = assertThrows(InvalidInputException.class,
                () -> CrossCheck.of(h).scheme(Scheme.magnus4()).run());
        assertTrue(noInterval.getMessage().contains("interval"));
        InvalidInputException dim = assertThrows(InvalidInputException.class,
                () -> CrossCheck.of(h).over(0, 1).scheme(Scheme.magnus4()).reference(Operator.identity(3)).run());
        assertEquals(InvalidInputException.Reason.DIMENSION_MISMATCH, dim.reason());
        assertThrows(InvalidInputException.class, () -> CrossCheck.of(h).scheme(Scheme.magnus4(), 0));
        assertThrows(InvalidInputException.class, () -> CrossCheck.of(h).over(0, Double.NaN));
        assertThrows(InvalidInputException.class, () -> CrossCheck.of(h).over(1, 1).scheme(Scheme.magnus4()).run());
    }
}
