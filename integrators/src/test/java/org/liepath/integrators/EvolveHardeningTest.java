package org.liepath.integrators;

import org.apache.commons.math3.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.liepath.algebra.LieAlgebra;
import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.StateVector;

import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Supplier;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Embedding hardening of {@link Evolve}: every scheme (fixed and adaptive, Wei–Norman with a chart, state and open
 * system modes) gives the same bits on eight threads at once as in a sequential run, and the same bits again on a
 * second run; a throwing listener leaves results untouched; cancellation is prompt; random configurations either
 * are refused with {@link InvalidInputException} or run to a {@link Status} without hanging.
 */
class EvolveHardeningTest {
    static final int THREADS = 8;
    static final Hamiltonian SMOOTH = ReferenceProblems.threeLevel().h();
    static final Hamiltonian PIECEWISE = Fixtures.piecewiseQubit();
    static final WeiNorman CHART = WeiNorman.of(LieAlgebra.generatedBy(SMOOTH));

    /** Raw result of a run: status kind, the output bits (propagator, state or density) and WN coordinates. */
    record Bits(Status.Kind kind, double[] re, double[] im, double[] coords) {
        boolean same(Bits b) {
            return kind == b.kind && Arrays.equals(re, b.re) && Arrays.equals(im, b.im) && Arrays.equals(coords, b.coords);
        }
    }

    static Bits bits(Evolution ev, Timeline.Mode mode) {
        double[] re, im;
        switch (mode) {
            case STATE -> {
                StateVector s = ev.state();
                re = new double[s.dim()];
                im = new double[s.dim()];
                s.copyTo(re, im);
            }
            case DENSITY -> {
                re = ev.density().reArray();
                im = ev.density().imArray();
            }
            default -> {
                re = ev.propagator().reArray();
                im = ev.propagator().imArray();
            }
        }
        double[] g = new double[0];
        Complex[] last = wnCoordinates(ev);
        if (last != null) {
            g = new double[2 * last.length];
            for (int k = 0; k < last.length; k++) {
                g[2 * k] = last[k].getReal();
                g[2 * k + 1] = last[k].getImaginary();
            }
        }
        return new Bits(ev.status().kind(), re, im, g);
    }

    /** Every scheme, fixed and adaptive where it allows both, plus state, density and Wei–Norman runs. */
    static Map<String, Supplier<Bits>> configurations() {
        Map<String, Supplier<Bits>> runs = new LinkedHashMap<>();
        for (SchemeCases.Case c : SchemeCases.all().toList()) {
            Hamiltonian h = c.exactPiecewise() ? PIECEWISE : SMOOTH;
            double t1 = c.exactPiecewise() ? 1.5 : 3;
            Evolve base = Evolve.of(h).over(0, t1).scheme(c.get());
            if (c.fixedStep()) {
                runs.put(c + " fixed", () -> bits(base.steps(37).run(), Timeline.Mode.PROPAGATOR));
            }
            runs.put(c + " adaptive", () -> bits(base.tolerance(1e-9).run(), Timeline.Mode.PROPAGATOR));
        }
        StateVector psi = StateVector.unit(3, 0);
        runs.put("magnus6 state adaptive", () -> bits(Evolve.of(SMOOTH).over(0, 3).scheme(Scheme.magnus6())
                .tolerance(1e-9).state(psi).run(), Timeline.Mode.STATE));
        runs.put("weiNorman adaptive", () -> bits(Evolve.of(SMOOTH).over(0, 3).scheme(Scheme.weiNorman(CHART))
                .tolerance(1e-9).run(), Timeline.Mode.PROPAGATOR));
        runs.put("weiNorman state", () -> bits(Evolve.of(SMOOTH).over(0, 3).scheme(Scheme.weiNorman(CHART))
                .state(psi).run(), Timeline.Mode.STATE));
        Lindbladian l = Lindbladian.builder(SMOOTH).jump(0.2, Operator.unit(3, 0, 1)).build();
        runs.put("open system density", () -> bits(Evolve.of(l).over(0, 2).density(Operator.unit(3, 1, 1))
                .tolerance(1e-9).run(), Timeline.Mode.DENSITY));
        return runs;
    }

    @Test
    void everySchemeGivesTheSameBitsOnEightThreadsAndOnASecondRun() throws Exception {
        Map<String, Supplier<Bits>> runs = configurations();
        Map<String, Bits> first = new LinkedHashMap<>();
        runs.forEach((name, run) -> first.put(name, run.get()));
        runs.forEach((name, run) -> assertTrue(first.get(name).same(run.get()), name + ": second run differs"));
        first.forEach((name, b) -> assertEquals(Status.Kind.SUCCESS, b.kind(), name));
        ExecutorService pool = Executors.newFixedThreadPool(THREADS);
        try {
            // all configurations interleaved, each three times, so that different schemes run side by side
            List<String> names = new ArrayList<>();
            List<Future<Bits>> fs = new ArrayList<>();
            for (int rep = 0; rep < 3; rep++) {
                for (Map.Entry<String, Supplier<Bits>> e : runs.entrySet()) {
                    names.add(e.getKey());
                    fs.add(pool.submit(() -> e.getValue().get()));
                }
            }
            for (int k = 0; k < fs.size(); k++) {
                assertTrue(first.get(names.get(k)).same(fs.get(k).get()), names.get(k) + ": parallel run differs");
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void weiNormanEquationsEvaluatedConcurrentlyGiveTheSameBits() throws Exception {
        WeiNormanEquations eqs = CHART.equations(SMOOTH);
        Complex[] g = new Complex[CHART.dimension()];
        Random r = new Random(11);
        for (int k = 0; k < g.length; k++) {
            g[k] = new Complex(0.1 * r.nextGaussian(), 0.1 * r.nextGaussian());
        }
        Complex[] seq = eqs.derivative(0.7, g);
        ExecutorService pool = Executors.newFixedThreadPool(THREADS);
        try {
            List<Future<Complex[]>> fs = new ArrayList<>();
            for (int k = 0; k < 64; k++) {
                fs.add(pool.submit(() -> eqs.derivative(0.7, g)));
            }
            for (Future<Complex[]> f : fs) {
                assertTrue(Arrays.equals(seq, f.get()), "concurrent derivative differs");
            }
        } finally {
            pool.shutdownNow();
        }
    }

    // ------------------------------------------------------------------ faults

    @Test
    void aThrowingListenerLeavesEveryKindOfRunUnchanged() {
        for (Map.Entry<String, Evolve> e : Map.of(
                "cf4opt adaptive", Evolve.of(SMOOTH).over(0, 3).tolerance(1e-9),
                "magnus8 fixed", Evolve.of(SMOOTH).over(0, 3).scheme(Scheme.magnus8()).steps(30),
                "reference", Evolve.of(SMOOTH).over(0, 3).scheme(Scheme.reference()).tolerance(1e-9),
                "weiNorman", Evolve.of(SMOOTH).over(0, 3).scheme(Scheme.weiNorman(CHART)).tolerance(1e-9)).entrySet()) {
            Operator clean = e.getValue().run().propagator();
            AtomicInteger calls = new AtomicInteger();
            Evolution ev = e.getValue().monitor((f, c) -> {
                if (calls.incrementAndGet() == 3) {
                    throw new IllegalStateException("listener bug");
                }
                return true;
            }).run();
            assertTrue(ev.status().isSuccess(), e.getKey() + ": " + ev.status());
            assertEquals(3, calls.get(), e.getKey() + ": a listener that threw should not be called again");
            assertNotNull(ev.stats().monitorFailure(), e.getKey());
            assertTrue(Exact.sameBits(clean, ev.propagator()), e.getKey() + ": a failing listener changed the result");
        }
    }

    @Test
    void cancellationMidRunIsPromptForAdaptiveReferenceAndWeiNormanRuns() {
        // each of these runs takes many seconds uncancelled: long intervals at tight tolerance
        Map<String, Evolve> long_ = Map.of(
                "cf4opt adaptive", Evolve.of(SMOOTH).over(0, 1e5).tolerance(1e-12).maxSteps(Long.MAX_VALUE),
                "reference", Evolve.of(SMOOTH).over(0, 1e5).scheme(Scheme.reference()).tolerance(1e-12)
                        .maxSteps(Long.MAX_VALUE),
                "weiNorman", Evolve.of(SMOOTH).over(0, 1e5).scheme(Scheme.weiNorman(CHART)).tolerance(1e-12)
                        .maxSteps(Long.MAX_VALUE));
        for (Map.Entry<String, Evolve> e : long_.entrySet()) {
            AtomicInteger calls = new AtomicInteger();
            Evolution ev = assertTimeoutPreemptively(Duration.ofSeconds(20),
                    () -> e.getValue().monitor((f, c) -> calls.incrementAndGet() < 50).run(), e.getKey());
            assertEquals(Status.Kind.CANCELLED, ev.status().kind(), e.getKey() + ": " + ev.status());
            assertFalse(ev.status().isSuccess());
            assertTrue(ev.status().time() < 1e5, e.getKey());
            assertEquals(50, calls.get(), e.getKey() + ": the listener was called after it asked to stop");
        }
    }

    /** Found by the fuzzing below: Wei–Norman runs used to ignore maxSteps (a long interval ran for minutes). */
    @Test
    void aWeiNormanRunStopsAtItsStepLimit() {
        Evolution ev = assertTimeoutPreemptively(Duration.ofSeconds(20), () -> Evolve.of(SMOOTH).over(0, 3e5)
                .scheme(Scheme.weiNorman(CHART)).maxSteps(200).run());
        assertEquals(Status.Kind.STEP_LIMIT, ev.status().kind(), ev.status().toString());
        assertTrue(ev.status().message().contains("200"), ev.status().toString());
        assertEquals(200, ev.stats().acceptedSteps());
        // a limit the run does not reach changes nothing
        Evolve shortRun = Evolve.of(SMOOTH).over(0, 3).scheme(Scheme.weiNorman(CHART));
        assertTrue(Exact.sameBits(shortRun.run().propagator(), shortRun.maxSteps(100_000).run().propagator()));
    }

    // ------------------------------------------------------------------ fuzzing the configuration

    static final Set<Status.Kind> RUN_KINDS = EnumSet.of(Status.Kind.SUCCESS, Status.Kind.STEP_LIMIT,
            Status.Kind.STEP_UNDERFLOW, Status.Kind.NON_FINITE);

    static double randomTime(Random r) {
        return switch (r.nextInt(12)) {
            case 0 -> Double.NaN;
            case 1 -> r.nextBoolean() ? Double.POSITIVE_INFINITY : Double.NEGATIVE_INFINITY;
            case 2 -> 0.0;
            case 3 -> r.nextBoolean() ? 1e-300 : -Double.MIN_VALUE;
            case 4 -> 1e6 * r.nextGaussian();
            case 5 -> Math.scalb(r.nextDouble(), 60);      // large times: 1 ulp is ~ 256
            default -> 5 * r.nextGaussian();
        };
    }

    static double randomTolerance(Random r) {
        return switch (r.nextInt(10)) {
            case 0 -> Double.NaN;
            case 1 -> 0.0;
            case 2 -> -1e-8;
            case 3 -> Double.MIN_VALUE;
            case 4 -> Double.POSITIVE_INFINITY;
            case 5 -> 1e300;
            case 6 -> 1e-300;
            default -> Math.pow(10, -16 * r.nextDouble());
        };
    }

    /**
     * One random configuration per seed: interval, scheme, tolerance or step count, step limit and mode are drawn
     * from ranges that include NaN, infinities, zero, negative, tiny and huge values. Configuration either throws
     * {@link InvalidInputException} or builds; a run ends within the bound with a status of a run-time kind, and a
     * success gives finite entries.
     */
    @ParameterizedTest(name = "seed {0}")
    @MethodSource("org.liepath.testing.Seeds#cases")
    void randomConfigurationsAreRefusedOrRunToAStatus(long seed) {
        Random r = new Random(seed);
        List<SchemeCases.Case> cases = SchemeCases.all().toList();
        SchemeCases.Case c = cases.get(r.nextInt(cases.size()));
        boolean wn = r.nextInt(10) == 0;
        Hamiltonian h = c.exactPiecewise() && !wn ? PIECEWISE : (r.nextBoolean() ? SMOOTH : Fixtures.drivenQubit());
        double t0 = randomTime(r), t1 = randomTime(r);
        int mode = r.nextInt(3);
        int steps = r.nextInt(4) == 0 ? -r.nextInt(5) : 1 + r.nextInt(2000);
        double tol = randomTolerance(r);
        long maxSteps = r.nextInt(4) == 0 ? r.nextInt(3) - 1 : 1 + r.nextInt(5000);
        boolean state = r.nextInt(4) == 0;
        int k0 = r.nextInt(h.dim());
        Scheme scheme = wn && h == SMOOTH ? Scheme.weiNorman(CHART) : c.get();
        String config = "seed " + seed + ": " + scheme.name() + " over(" + t0 + ", " + t1 + ") "
                + (mode == 0 ? "steps(" + steps + ")" : mode == 1 ? "tolerance(" + tol + ")" : "default")
                + " maxSteps(" + maxSteps + ")" + (state ? " state" : "") + " dim " + h.dim();
        Evolution ev = assertTimeoutPreemptively(Duration.ofSeconds(30), () -> {
            try {
                Evolve e = Evolve.of(h).over(t0, t1).scheme(scheme);
                e = mode == 0 ? e.steps(steps) : mode == 1 ? e.tolerance(tol) : e;
                e = e.maxSteps(maxSteps);
                if (state) {
                    e = e.state(StateVector.unit(h.dim(), k0));
                }
                return e.run();
            } catch (InvalidInputException refused) {
                assertNotNull(refused.reason());
                assertNotNull(refused.argument(), refused.getMessage());
                assertTrue(refused.getMessage().contains(refused.argument()), refused.getMessage());
                return null;
            }
        }, config);
        if (ev == null) {
            return;
        }
        Status s = ev.status();
        assertTrue(RUN_KINDS.contains(s.kind()), config + ": " + s);
        if (s.isSuccess()) {
            Bits b = bits(ev, hasState(ev) ? Timeline.Mode.STATE
                    : Timeline.Mode.PROPAGATOR);
            for (int k = 0; k < b.re().length; k++) {
                assertTrue(Double.isFinite(b.re()[k]) && Double.isFinite(b.im()[k]), config + ": " + s);
            }
        }
    }

    private static Complex[] wnCoordinates(Evolution ev) {
        try {
            return ev.coordinates().last();
        } catch (IllegalStateException notWeiNorman) {
            return null;
        }
    }

    private static boolean hasState(Evolution ev) {
        try {
            ev.state();
            return true;
        } catch (IllegalStateException notStateMode) {
            return false;
        }
    }
}
