package org.liepath.algebra;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Operator;

import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.concurrent.Callable;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Embedding hardening of the algebra module: closures are deterministic (bit for bit across threads and across runs
 * in one JVM), a misbehaving progress listener neither corrupts nor blocks a closure, cancellation is prompt, and
 * text parsers let only {@link InvalidInputException} escape on any input (seeded fuzzing; common practice).
 */
class AlgebraHardeningTest {
    static final int THREADS = 8;

    /** Bases compared on the raw bits of every entry (so −0.0 vs 0.0 counts as a difference). */
    static void sameBits(List<Operator> a, List<Operator> b, String what) {
        assertEquals(a.size(), b.size(), what + ": dimension");
        for (int k = 0; k < a.size(); k++) {
            assertTrue(Arrays.equals(a.get(k).reArray(), b.get(k).reArray())
                    && Arrays.equals(a.get(k).imArray(), b.get(k).imArray()), what + ": basis element " + k + " differs");
        }
    }

    /** Runs the task on THREADS threads at once (twice as many tasks as threads) and returns the results. */
    static <T> List<T> concurrently(Callable<T> task) throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(THREADS);
        try {
            List<Future<T>> fs = new ArrayList<>();
            for (int k = 0; k < 2 * THREADS; k++) {
                fs.add(pool.submit(task));
            }
            List<T> out = new ArrayList<>();
            for (Future<T> f : fs) {
                out.add(f.get());
            }
            return out;
        } finally {
            pool.shutdownNow();
        }
    }

    // ------------------------------------------------------------------ concurrency and determinism

    @Test
    void lieClosureIsBitIdenticalAcrossThreadsAndRuns() throws Exception {
        // XY + ZZ couplings on a 3-site path: a 63-dimensional su(8) closure with many brackets
        List<Operator> gens = Gens.localXYPlusZZ(3, Gens.path(3, 2));
        LieAlgebra seq = LieAlgebra.generatedBy(gens);
        LieAlgebra again = LieAlgebra.generatedBy(gens);
        sameBits(seq.basis(), again.basis(), "second sequential run");
        assertEquals(seq.type(), again.type());
        for (LieAlgebra g : concurrently(() -> LieAlgebra.generatedBy(gens))) {
            sameBits(seq.basis(), g.basis(), "parallel closure");
            assertEquals(seq.type(), g.type());
        }
    }

    @Test
    void lieClosureOfRandomGeneratorsIsBitIdenticalAcrossThreads() throws Exception {
        List<Operator> gens = LieAlgebraPropertiesTest.randomGenerators(new Random(0x5EEDL));
        LieAlgebra seq = LieAlgebra.generatedBy(gens);
        String type = seq.type();
        for (LieAlgebra g : concurrently(() -> LieAlgebra.generatedBy(gens))) {
            sameBits(seq.basis(), g.basis(), "parallel closure");
            assertEquals(type, g.type());
        }
    }

    @Test
    void pauliClosureIsIdenticalAcrossThreadsAndRuns() throws Exception {
        List<PauliCombination> perTerm = SpinChains.isingPerTerm(8);
        List<PauliCombination> summed = SpinChains.isingSummed(6, true);
        for (List<PauliCombination> gens : List.of(perTerm, summed)) {
            PauliAlgebra seq = PauliAlgebra.generatedBy(gens);
            PauliAlgebra again = PauliAlgebra.generatedBy(gens);
            // PauliCombination.equals compares strings and bit-identical coefficients, in order of the basis list
            assertEquals(seq.basis(), again.basis(), "second sequential run");
            assertEquals(seq.type(), again.type());
            for (PauliAlgebra a : concurrently(() -> PauliAlgebra.generatedBy(gens))) {
                assertEquals(seq.basis(), a.basis(), "parallel Pauli closure");
                assertEquals(seq.type(), a.type());
            }
        }
    }

    // ------------------------------------------------------------------ faults: listeners

    @Test
    void aThrowingListenerDoesNotChangeALieClosure() {
        List<Operator> gens = Gens.localXYPlusZZ(3, Gens.path(3, 2));
        LieAlgebra clean = LieAlgebra.generatedBy(gens);
        AtomicInteger calls = new AtomicInteger();
        LieAlgebra withBug = LieAlgebra.closure().monitor((f, c) -> {
            calls.incrementAndGet();
            throw new IllegalStateException("listener bug");
        }).of(gens);
        assertEquals(1, calls.get(), "a listener that threw should not be called again");
        sameBits(clean.basis(), withBug.basis(), "closure with a throwing listener");
        assertEquals(clean.type(), withBug.type());
    }

    @Test
    void aListenerThatThrowsLateDoesNotChangeAPauliClosure() {
        List<PauliCombination> gens = SpinChains.isingPerTerm(12);
        PauliAlgebra clean = PauliAlgebra.generatedBy(gens);
        AtomicInteger calls = new AtomicInteger();
        PauliAlgebra withBug = PauliAlgebra.generatedBy(gens, PauliAlgebra.DEFAULT_MAX_DIMENSION, (f, c) -> {
            if (calls.incrementAndGet() >= 2) {
                throw new OutOfMemoryErrorLookalike();
            }
            return true;
        });
        assertEquals(clean.basis(), withBug.basis());
        assertEquals(clean.type(), withBug.type());
    }

    /** An unchecked exception of a type the library cannot know about. */
    static final class OutOfMemoryErrorLookalike extends RuntimeException {
        private static final long serialVersionUID = 1L;
    }

    @Test
    void cancellingALargeLieClosureIsPrompt() {
        // su(16) from XY+ZZ on a 4-site path: 255 elements of 16×16, seconds of work if not cancelled
        List<Operator> gens = Gens.localXYPlusZZ(4, Gens.path(4, 3));
        assertTimeoutPreemptively(Duration.ofSeconds(20), () -> {
            CancellationException e = assertThrows(CancellationException.class,
                    () -> LieAlgebra.closure().monitor((f, c) -> c < 20).of(gens));
            assertNotNull(e.getMessage());
        });
    }

    @Test
    void cancellingALargePauliClosureIsPrompt() {
        // the per-term Ising chain on 40 qubits closes to so(80) (3160 strings): cancel early
        List<PauliCombination> gens = SpinChains.isingPerTerm(40);
        assertTimeoutPreemptively(Duration.ofSeconds(20), () -> assertThrows(CancellationException.class,
                () -> PauliAlgebra.generatedBy(gens, PauliAlgebra.DEFAULT_MAX_DIMENSION, (f, c) -> c < 50)));
    }

    // ------------------------------------------------------------------ fuzzing the parsers

    /** Parses or refuses; a parsed sum must print and parse back to itself. */
    static void parseOrRefuse(String text) {
        try {
            PauliCombination s = PauliCombination.parse(text);
            assertEquals(s, PauliCombination.parse(s.toString()), text);
        } catch (InvalidInputException e) {
            assertNotNull(e.reason());
            assertNotNull(e.getMessage());
        }
    }

    static void stringOrRefuse(String text) {
        try {
            PauliString p = PauliString.of(text);
            assertEquals(p, PauliString.of(p.toString()), text);
        } catch (InvalidInputException e) {
            assertNotNull(e.reason());
            assertNotNull(e.getMessage());
        }
    }

    /** Random bytes decoded as ISO-8859-1 and as UTF-8 (malformed sequences become U+FFFD). */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void byteLevelJunkOnlyThrowsInvalidInput(long seed) {
        Random r = new Random(seed);
        assertTimeoutPreemptively(Duration.ofSeconds(30), () -> {
            for (int rep = 0; rep < 20; rep++) {
                byte[] b = new byte[r.nextInt(64)];
                r.nextBytes(b);
                for (String text : List.of(new String(b, java.nio.charset.StandardCharsets.ISO_8859_1),
                        new String(b, java.nio.charset.StandardCharsets.UTF_8))) {
                    parseOrRefuse(text);
                    stringOrRefuse(text);
                }
            }
        });
    }

    /** Near-valid texts: valid terms with huge or tiny exponents, unicode signs and digits, control characters. */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#fewCases")
    void nearValidTextOnlyThrowsInvalidInput(long seed) {
        Random r = new Random(seed);
        String[] coeffs = {"1e308", "1e309", "-1e309", "1e-400", "4.9e-324", "1e2147483648", "1e-2147483649",
                "0x10", "1_000", "NaN", "Infinity", "-Infinity", "١٢", "½", "1.7976931348623157e308", "9".repeat(400),
                "0." + "0".repeat(400) + "1", "--1", "+-2", "1e", ".", "-", "1..2", "\u22122", "\u00a01"};
        String[] seps = {" + ", " - ", "+", "-", " \u2212 ", "*", " * ", "\t+\n", "\u0000", "\u200b+", "  ", ""};
        String letters = "IXYZixyzQ\u0399\u03a7";   // including Greek capital iota and chi (look-alikes)
        assertTimeoutPreemptively(Duration.ofSeconds(30), () -> {
            for (int rep = 0; rep < 20; rep++) {
                int qubits = 1 + r.nextInt(5);
                StringBuilder b = new StringBuilder();
                int terms = 1 + r.nextInt(4);
                for (int t = 0; t < terms; t++) {
                    if (t > 0) {
                        b.append(seps[r.nextInt(seps.length)]);
                    }
                    if (r.nextBoolean()) {
                        b.append(coeffs[r.nextInt(coeffs.length)]).append(r.nextBoolean() ? " " : "*");
                    }
                    int len = r.nextInt(8) < 7 ? qubits : r.nextInt(8);
                    for (int k = 0; k < len; k++) {
                        b.append(r.nextInt(10) < 9 ? "IXYZ".charAt(r.nextInt(4)) : letters.charAt(r.nextInt(letters.length())));
                    }
                }
                parseOrRefuse(b.toString());
                stringOrRefuse(b.toString().replaceAll("[^A-Za-z\u0399\u03a7]", ""));
            }
        });
    }

    @Test
    void hugeAndNonFiniteCoefficientsAreRefusedWithTheValueSeen() {
        for (String c : List.of("1e309", "-1e999", "1e2147483648")) {
            InvalidInputException e = assertThrows(InvalidInputException.class, () -> PauliCombination.parse(c + " XY"));
            assertEquals(InvalidInputException.Reason.NOT_FINITE, e.reason(), e.getMessage());
            assertTrue(e.getMessage().startsWith("text"), e.getMessage());
        }
        // a coefficient that underflows to zero is a legal (zero) term, not an error
        assertTrue(PauliCombination.parse("1e-400 XY").isZero());
    }

    @Test
    void longInputsParseOrFailInLinearTime() {
        assertTimeoutPreemptively(Duration.ofSeconds(20), () -> {
            String word = "XYZI".repeat(2_500);                           // 10 000 qubits
            assertEquals(10_000, PauliString.of(word).qubits());
            StringBuilder many = new StringBuilder();
            for (int k = 0; k < 20_000; k++) {
                many.append(k == 0 ? "" : " + ").append(k % 7).append(' ').append("XYZ".charAt(k % 3)).append("IZ");
            }
            assertEquals(3, PauliCombination.parse(many.toString()).qubits());
            parseOrRefuse("+".repeat(100_000));
            parseOrRefuse("1".repeat(100_000) + " X");
            parseOrRefuse("(".repeat(100_000));
        });
    }
}
