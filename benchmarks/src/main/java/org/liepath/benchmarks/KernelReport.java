package org.liepath.benchmarks;

import org.liepath.core.internal.Expm;
import org.liepath.core.internal.HermitianExp;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.openjdk.jmh.runner.options.TimeValue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Collection;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;

/**
 * Runs the core kernel benchmarks ({@link MatMulBenchmark}, {@link ExpmBenchmark}, {@link HermitianExpBenchmark})
 * in one JMH session and prints, per N, the times, the ratio against the comparator measured in the same run, and
 * for the product the achieved GFLOP/s (8N³ flops) next to the double-precision peak of one core.
 *
 * <p>Peak: 16 flops per cycle (two 256-bit FMA pipes × 4 doubles × 2 flops, AVX2 + FMA as reported by
 * /proc/cpuinfo) times the clock; on these machines a FMA loop measured ≈ 47 GFLOP/s per core, the default of the
 * system property {@code liepath.peakGflops}.
 *
 * <p>Run: {@code java -cp benchmarks/target/benchmarks.jar org.liepath.benchmarks.KernelReport [regex [sizes]]}
 * (sizes comma-separated, default 2,4,8,16,64,256; short
 * settings: 1 fork, 3 warm-up and 5 measured iterations of 1 s). The machine is shared, so the numbers are rough.
 */
public final class KernelReport {
    private KernelReport() {
    }

    public static void main(String[] args) throws RunnerException {
        String include = args.length > 0 ? args[0] : "org.liepath.benchmarks.(MatMul|Expm|HermitianExp)Benchmark";
        OptionsBuilder ob = new OptionsBuilder();
        ob.include(include).forks(1).warmupIterations(3).measurementIterations(5)
                .warmupTime(TimeValue.seconds(1)).measurementTime(TimeValue.seconds(1));
        if (args.length > 1) {
            ob.param("n", args[1].split(","));
        }
        Options opt = ob.build();
        Collection<RunResult> results = new Runner(opt).run();
        // benchmark → n → ns/op
        Map<String, Map<Integer, Double>> ns = new TreeMap<>();
        for (RunResult rr : results) {
            String name = rr.getParams().getBenchmark();
            name = name.substring(name.lastIndexOf('.', name.lastIndexOf('.') - 1) + 1);
            int n = Integer.parseInt(rr.getParams().getParam("n"));
            ns.computeIfAbsent(name, k -> new TreeMap<>()).put(n, rr.getPrimaryResult().getScore());
        }
        double peak = Double.parseDouble(System.getProperty("liepath.peakGflops", "47"));
        System.out.printf(Locale.ROOT, "%nPeak (one core, double precision): %.1f GFLOP/s (%s)%n", peak, clockNote());
        table(ns, "MatMulBenchmark", new String[]{"liepath", "ejml", "ejmlWithConversion", "previousKernel"}, true, peak);
        table(ns, "ExpmBenchmark", new String[]{"liepath", "ejmlPade"}, false, peak);
        table(ns, "HermitianExpBenchmark", new String[]{"eigenRoute", "padeRoute", "eigendecompositionOnly"}, false, peak);
        unitarity(ns.getOrDefault("HermitianExpBenchmark.eigenRoute", Map.of()).keySet());
    }

    private static void table(Map<String, Map<Integer, Double>> ns, String bench, String[] methods, boolean flops,
                              double peak) {
        Map<Integer, Double> base = ns.get(bench + "." + methods[0]);
        if (base == null) {
            return;
        }
        System.out.printf(Locale.ROOT, "%n%s (ns/op; ratio = other / %s, > 1 means %s is faster)%n", bench, methods[0],
                methods[0]);
        StringBuilder head = new StringBuilder(String.format(Locale.ROOT, "%6s", "N"));
        for (String m : methods) {
            head.append(String.format(Locale.ROOT, " %16s", m));
            if (m != methods[0]) {
                head.append(String.format(Locale.ROOT, " %7s", "ratio"));
            }
        }
        if (flops) {
            head.append("   GFLOP/s: ").append(methods[0]).append(" / ").append(methods[1]).append(" (% of peak)");
        }
        System.out.println(head);
        for (Map.Entry<Integer, Double> e : base.entrySet()) {
            int n = e.getKey();
            double t0 = e.getValue();
            StringBuilder row = new StringBuilder(String.format(Locale.ROOT, "%6d %16.1f", n, t0));
            for (int k = 1; k < methods.length; k++) {
                Double t = ns.getOrDefault(bench + "." + methods[k], Map.of()).get(n);
                row.append(t == null ? String.format(Locale.ROOT, " %16s %7s", "-", "-")
                        : String.format(Locale.ROOT, " %16.1f %7.2f", t, t / t0));
            }
            if (flops) {
                double f = 8.0 * n * n * n;
                Double t1 = ns.getOrDefault(bench + "." + methods[1], Map.of()).get(n);
                double g0 = f / t0, g1 = t1 == null ? Double.NaN : f / t1;
                row.append(String.format(Locale.ROOT, "   %5.2f / %5.2f (%4.1f%% / %4.1f%%)", g0, g1, 100 * g0 / peak,
                        100 * g1 / peak));
            }
            System.out.println(row);
        }
    }

    /** Unitarity defect ‖U†U − I‖_F of both routes on the benchmark's matrices (accuracy next to speed). */
    private static void unitarity(Iterable<Integer> sizes) {
        System.out.printf(Locale.ROOT, "%nUnitarity defect ‖U†U − I‖_F of exp(−itH), t = 1, same matrices%n%6s %12s %12s%n",
                "N", "eigen", "Padé");
        for (int n : sizes) {
            double[] hr = new double[n * n], hi = new double[n * n];
            HermitianExpBenchmark.randomHermitian(new Random(3), n, hr, hi);
            double[] ur = new double[n * n], ui = new double[n * n];
            new HermitianExp(n).compute(hr, hi, 1.0, ur, ui);
            double de = defect(n, ur, ui);
            double[] ar = new double[n * n], ai = new double[n * n];
            for (int k = 0; k < n * n; k++) {
                ar[k] = hi[k];
                ai[k] = -hr[k];
            }
            new Expm(n).compute(1.0, ar, ai, ur, ui);
            System.out.printf(Locale.ROOT, "%6d %12.2e %12.2e%n", n, de, defect(n, ur, ui));
        }
    }

    static double defect(int n, double[] ur, double[] ui) {
        double s = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double re = 0, im = 0;
                for (int k = 0; k < n; k++) {
                    re += ur[k * n + i] * ur[k * n + j] + ui[k * n + i] * ui[k * n + j];
                    im += ur[k * n + i] * ui[k * n + j] - ui[k * n + i] * ur[k * n + j];
                }
                re -= i == j ? 1 : 0;
                s += re * re + im * im;
            }
        }
        return Math.sqrt(s);
    }

    private static String clockNote() {
        try {
            for (String line : Files.readAllLines(Path.of("/proc/cpuinfo"))) {
                if (line.startsWith("cpu MHz")) {
                    double mhz = Double.parseDouble(line.substring(line.indexOf(':') + 1).trim());
                    return String.format(Locale.ROOT, "16 flop/cycle × %.0f MHz nominal = %.1f; measured FMA loop ≈ 47",
                            mhz, 16 * mhz / 1000);
                }
            }
        } catch (Exception ignored) {
            // not Linux: fall through
        }
        return "measured FMA loop on these machines";
    }
}
