package org.liepath.validation;

import org.liepath.algebra.LieAlgebra;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.core.ProgressListener;
import org.liepath.core.StateVector;
import org.liepath.core.Superoperator;
import org.liepath.core.internal.Require;
import org.liepath.integrators.Evolution;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;
import org.liepath.integrators.Timeline;
import org.liepath.integrators.WeiNorman;
import org.liepath.validation.internal.TextTable;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Consumer;

/**
 * The Liepath demo: a made-up scenario taken end to end through the library, written up as a report folder.
 *
 * <p><b>Scenario (invented numbers, for illustration only).</b> Two coupled two-level systems, sites A and B, in a
 * rotating frame: H(t) = (δ_A(t)/2) Z⊗I + (δ_B/2) I⊗Z + J(t) (X⊗X + Y⊗Y)/2, with a Gaussian exchange pulse J(t)
 * whose area is π/2 (which alone gives the exchange gate exp(−i(π/4)(XX + YY))) and a sine-shaped detuning pulse on
 * site A. The open-system part adds weak relaxation (amplitude damping and pure dephasing on each site).
 *
 * <p><b>What it does.</b> Finds the dynamical Lie algebra of the Hamiltonian's terms and its type; proposes a
 * Wei–Norman chart when the algebra has at most {@link #MAX_CHART_DIMENSION} elements and evolves in it; evolves
 * with several schemes and cross-checks them against the reference integrator; compares with the truncated Magnus
 * series; measures observed orders; computes gate fidelities to the target gate for the closed and the open
 * system; checks unitarity, trace preservation and complete positivity; and writes {@value Report#SUMMARY} with
 * PNG plots (populations, work–precision, convergence orders, purity and entropy).
 *
 * <p>Run from the repository root after building the all-in-one jar:
 * {@code java -jar validation/target/liepath-all.jar [report-folder]} (default {@value #DEFAULT_FOLDER}).
 * Takes a few seconds. {@link #run(Path, Consumer)} is the same without a console.
 *
 * <p>Thread-safety: the class holds no mutable state; runs on several threads at once are safe as long as each writes
 * to its own folder.
 */
public final class Demo {
    /** Default report folder, relative to the working directory. */
    public static final String DEFAULT_FOLDER = "liepath-report";

    /** Largest algebra for which the demo proposes a Wei–Norman chart. */
    public static final int MAX_CHART_DIMENSION = 8;

    // invented scenario parameters (rad per time unit, time units)
    static final double T = 10, DELTA_A = 0.06, DELTA_A_SWING = 0.03, DELTA_B = -0.04;
    static final double SIGMA = T / 6, GAMMA_1 = 0.004, GAMMA_PHI = 0.008;

    private Demo() {
    }

    /**
     * What {@link #run} computed: the written report and the headline figures by name (as written in the summary).
     * Immutable (the map is an unmodifiable copy) and thread-safe.
     */
    public record Outcome(Report report, Map<String, String> figures) {
    }

    /**
     * Runs the demo; prints progress to the console. Argument: the report folder (default liepath-report).
     *
     * @param args the command-line arguments
     */
    public static void main(String[] args) {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        Path folder = Path.of(args.length > 0 ? args[0] : DEFAULT_FOLDER);
        long t0 = System.nanoTime();
        Outcome o = run(folder, System.out::println);
        System.out.printf(Locale.ROOT, "Report written to %s (%.1f s)%n", o.report().summary().toAbsolutePath(),
                (System.nanoTime() - t0) * 1e-9);
    }

    /** The exchange pulse J(t): a Gaussian of area π/2 (truncated to [0, T], area corrected for the truncation). */
    static Drive exchangePulse() {
        double erf = org.apache.commons.math3.special.Erf.erf(T / 2 / (SIGMA * Math.sqrt(2)));
        double amp = (Math.PI / 2) / (SIGMA * Math.sqrt(2 * Math.PI) * erf);
        return Drive.gaussian(amp, T / 2, SIGMA).named("J(t)");
    }

    /**
     * The demo Hamiltonian (invented numbers).
     *
     * @return the demo Hamiltonian (invented numbers)
     */
    public static Hamiltonian hamiltonian() {
        Drive detuning = Drive.sine(DELTA_A_SWING / 2, 2 * Math.PI / T, 0).plus(Drive.constant(DELTA_A / 2))
                .named("δ_A(t)/2");
        Operator exchange = Pauli.string("XX").plus(Pauli.string("YY")).scale(0.5);
        return Hamiltonian.builder(4).term(Pauli.string("ZI"), detuning).term(DELTA_B / 2, Pauli.string("IZ"))
                .term(exchange, exchangePulse()).build();
    }

    /**
     * The target gate exp(−i(π/4)(XX + YY)).
     *
     * @return the target gate exp(−i(π/4)(XX + YY))
     */
    public static Operator target() {
        return Pauli.string("XX").plus(Pauli.string("YY")).expMinusI(Math.PI / 4);
    }

    /**
     * The demo GKLS generator: the Hamiltonian plus amplitude damping (γ₁) and dephasing (γ_φ) on each site.
     *
     * @return the demo GKLS generator
     */
    public static Lindbladian lindbladian() {
        Operator lower = Operator.unit(2, 0, 1);   // |0⟩⟨1|: decay into |0⟩, taken as the ground level
        Operator id = Operator.identity(2);
        return Lindbladian.builder(hamiltonian())
                .jump(GAMMA_1, lower.kron(id)).jump(GAMMA_1, id.kron(lower))
                .jump(GAMMA_PHI / 2, Pauli.string("ZI")).jump(GAMMA_PHI / 2, Pauli.string("IZ")).build();
    }

    private static ProgressListener progress(Consumer<String> log, String what) {
        int[] last = {-1};
        return (f, c) -> {
            int pct = Double.isNaN(f) ? -1 : (int) Math.floor(f * 4);
            if (pct > last[0]) {
                last[0] = pct;
                log.accept(String.format(Locale.ROOT, "    %s: %3.0f%% (%d)", what, Math.min(100, pct * 25.0), c));
            }
            return true;
        };
    }

    private static String sci(double v) {
        return TextTable.sci(v);
    }

    private static String fix(double v) {
        return TextTable.fixed(v, 6);
    }

    /**
     * Runs the demo and writes the report.
     *
     * @param folder the report folder (created if needed)
     * @param log    receives one line per stage and progress report (pass {@code s -> { }} for silence)
     * @return the written report and its headline figures
     */
    public static Outcome run(Path folder, Consumer<String> log) {
        Require.nonNull(folder, "folder");
        Require.nonNull(log, "log");
        Map<String, String> fig = new LinkedHashMap<>();
        Hamiltonian h = hamiltonian();
        Operator target = target();
        Report.Builder rep = Report.builder("Liepath demo: two coupled two-level systems under shaped pulses");
        rep.paragraph("**All numbers in this scenario are invented for illustration** (no device or experiment is "
                + "modelled). Units: ħ = 1, angular frequencies in rad per time unit.");
        rep.heading("Scenario");
        rep.paragraph(String.format(Locale.ROOT, "H(t) = (δ_A(t)/2) Z⊗I + (δ_B/2) I⊗Z + J(t) (X⊗X + Y⊗Y)/2 on [0, %s]"
                + " with δ_A(t) = %s + %s·sin(2πt/T), δ_B = %s, and a Gaussian exchange pulse J(t) centred at T/2, "
                + "width σ = T/6, area π/2. Target gate: exp(−i(π/4)(XX + YY)). Open system: amplitude damping "
                + "γ₁ = %s and dephasing γ_φ = %s on each site.", T, DELTA_A, DELTA_A_SWING, DELTA_B, GAMMA_1, GAMMA_PHI));

        // 1. algebra and chart
        log.accept("[1/7] Dynamical Lie algebra");
        LieAlgebra dla = LieAlgebra.generatedBy(h);
        String type = dla.type();
        fig.put("algebra dimension", Integer.toString(dla.dimension()));
        fig.put("algebra type", type);
        log.accept("    dimension " + dla.dimension() + ", type " + type);
        rep.heading("Dynamical Lie algebra");
        StringBuilder alg = new StringBuilder();
        alg.append("The terms generate a real Lie algebra of dimension ").append(dla.dimension())
                .append(", type **").append(type).append("** (").append(dla.isFullUnitary() ? "" : "not ")
                .append("the full unitary algebra u(4)).");
        Operator reference;
        Evolution refRun = Evolve.of(h).over(0, T).scheme(Scheme.reference())
                .tolerance(CrossCheck.DEFAULT_REFERENCE_TOLERANCE).run();
        reference = refRun.propagator();
        WeiNorman chart = null;
        if (dla.dimension() <= MAX_CHART_DIMENSION) {
            chart = WeiNorman.of(dla.basis());
            Evolution wn = Evolve.of(h).over(0, T).scheme(Scheme.weiNorman(chart)).tolerance(1e-10)
                    .monitor(progress(log, "Wei–Norman run")).run();
            double err = wn.propagator().distance(reference);
            fig.put("Wei–Norman error", sci(err));
            fig.put("Wei–Norman charts", Integer.toString(wn.stats().charts()));
            alg.append(" It is small enough for a Wei–Norman chart: U = Π exp(g_k X_k) over its ")
                    .append(dla.dimension()).append(" orthonormal basis elements, so only ")
                    .append(dla.dimension()).append(" coordinates are integrated instead of 16 matrix entries. ")
                    .append("Evolved in that chart (tolerance 1e-10, ").append(wn.stats().charts())
                    .append(" chart(s)): error against the reference ").append(sci(err)).append('.');
        } else {
            alg.append(" It is too large for the demo's Wei–Norman chart (limit ").append(MAX_CHART_DIMENSION)
                    .append(").");
        }
        rep.paragraph(alg.toString());
        if (chart != null) {
            String eqs = chart.equations(h).render();
            if (eqs.length() <= 4000) {
                rep.paragraph("Coordinate equations of the proposed chart (as rendered by the library):");
                rep.preformatted(eqs);
            }
        }

        // 2. cross-check of schemes
        log.accept("[2/7] Cross-check of schemes against the reference integrator");
        CrossCheck.Builder ccb = CrossCheck.of(h).over(0, T).reference(reference)
                .scheme(Scheme.exponentialMidpoint(), 400).scheme(Scheme.magnus4(), 50)
                .scheme(Scheme.commutatorFree4(), 50).scheme(Scheme.commutatorFree4Opt(), 50)
                .scheme(Scheme.magnus6(), 25).scheme(Scheme.magnus6().inInteractionPicture(), 25)
                .scheme(Scheme.commutatorFree6(), 25).scheme(Scheme.magnus8(), 16)
                .scheme(Scheme.commutatorFree4Opt()).tolerance(1e-10)
                .monitor(progress(log, "schemes"));
        if (chart != null) {
            ccb.scheme(Scheme.weiNorman(chart));
        }
        CrossCheck cc = ccb.run();
        double maxUnit = 0;
        for (CrossCheck.Row r : cc.rows().subList(1, cc.rows().size())) {
            maxUnit = Math.max(maxUnit, r.structureError());
        }
        fig.put("reference unitarity error", sci(Checks.unitarityError(reference)));
        fig.put("largest scheme unitarity error", sci(maxUnit));
        rep.heading("Schemes against the reference");
        rep.paragraph("Reference: Commons Math Dormand–Prince 8(5,3) at tolerance "
                + sci(CrossCheck.DEFAULT_REFERENCE_TOLERANCE) + " (" + refRun.stats().acceptedSteps()
                + " steps; unitarity error " + fig.get("reference unitarity error") + ", as it is not structure "
                + "preserving). Largest unitarity error of the Lie-group schemes: " + fig.get("largest scheme unitarity error") + ".");
        rep.table(cc.toMarkdown());
        cc.writeCsv(folder.resolve("schemes.csv"));

        // 3. Magnus series
        log.accept("[3/7] Magnus series");
        MagnusSeries ms = MagnusSeries.of(h, 0, T);
        fig.put("convergence indicator", fix(ms.convergenceIndicator()));
        TextTable mt = new TextTable("terms", "‖exp(Ω1+…+Ωk) − U_ref‖_F");
        for (int k = 1; k <= 4; k++) {
            double e = ms.propagator(k).distance(reference);
            mt.add(k, sci(e));
            fig.put("Magnus error k=" + k, sci(e));
        }
        // the same truncations composed over short pieces, where each piece's series converges fast
        int pieces = 10;
        Operator[] comp = {Operator.identity(4), Operator.identity(4), Operator.identity(4), Operator.identity(4)};
        for (int j = 0; j < pieces; j++) {
            MagnusSeries piece = MagnusSeries.of(h, T * j / pieces, T * (j + 1) / pieces);
            for (int k = 1; k <= 4; k++) {
                comp[k - 1] = piece.propagator(k).times(comp[k - 1]);
            }
        }
        TextTable ct = new TextTable("terms per piece", "‖Π exp(Ω1+…+Ωk) − U_ref‖_F");
        for (int k = 1; k <= 4; k++) {
            double e = comp[k - 1].distance(reference);
            ct.add(k, sci(e));
            fig.put("composite Magnus error k=" + k, sci(e));
        }
        rep.heading("Magnus series");
        rep.paragraph("∫‖H(t)‖₂ dt = " + fig.get("convergence indicator") + (ms.isConvergenceGuaranteed()
                ? " < π: the Magnus series is guaranteed to converge (Moan & Niesen 2008)."
                : " ≥ π: convergence is not guaranteed by the Moan–Niesen condition.")
                + " Truncations of the series, evaluated by Gauss–Legendre quadrature of the nested commutator integrals:");
        rep.table(mt.markdown());
        rep.paragraph("The same truncations on " + pieces + " pieces of length T/" + pieces
                + ", multiplied in time order (each piece's ∫‖H‖₂ is about a tenth of the total):");
        rep.table(ct.markdown());

        // 4. convergence orders
        log.accept("[4/7] Observed orders");
        Scheme[] studied = {Scheme.exponentialMidpoint(), Scheme.magnus4(), Scheme.commutatorFree4Opt(),
                Scheme.magnus6(), Scheme.commutatorFree6()};
        int[] starts = {16, 8, 8, 4, 4};
        Report.Plot conv = Report.plot("convergence.png", "Observed order of convergence", "step size",
                "error ‖U − U_ref‖_F").logX().logY();
        Report.Plot work = Report.plot("work-precision.png", "Work–precision", "generator evaluations",
                "error ‖U − U_ref‖_F").logX().logY();
        TextTable ot = new TextTable("scheme", "declared order", "observed order", "fitted step counts");
        for (int s = 0; s < studied.length; s++) {
            ConvergenceStudy st = ConvergenceStudy.of(h, 0, T, studied[s], reference).steps(starts[s], 6).run();
            List<ConvergenceStudy.Point> pts = st.points();
            double[] hs = new double[pts.size()], es = new double[pts.size()], ev = new double[pts.size()];
            for (int k = 0; k < pts.size(); k++) {
                hs[k] = pts.get(k).stepSize();
                es[k] = pts.get(k).error();
                ev[k] = pts.get(k).evaluations();
            }
            conv.points(studied[s].name(), hs, es);
            work.points(studied[s].name(), ev, es);
            int[] rg = st.fittedRange();
            String range = rg.length == 0 ? "—" : pts.get(rg[0]).steps() + " … " + pts.get(rg[1]).steps();
            ot.add(studied[s].name(), studied[s].order(), TextTable.fixed(st.observedOrder(), 2), range);
            fig.put("observed order " + studied[s].name(), TextTable.fixed(st.observedOrder(), 2));
            log.accept("    " + studied[s].name() + ": observed order " + TextTable.fixed(st.observedOrder(), 2));
        }
        rep.heading("Observed orders of convergence");
        rep.paragraph("Fixed steps halved five times; slope of log(error) against log(step size), fitted where the "
                + "local slopes have settled and the error is above rounding.");
        rep.table(ot.markdown());
        rep.figure(conv);
        rep.figure(work);

        // 5. gate fidelity and populations
        log.accept("[5/7] Gate fidelity and populations");
        double fClosed = Fidelity.averageGate(target, reference);
        fig.put("gate fidelity (closed)", fix(fClosed));
        int samples = 201;
        double[] times = new double[samples];
        for (int k = 0; k < samples; k++) {
            times[k] = T * k / (samples - 1);
        }
        StateVector psi0 = StateVector.unit(4, 1);    // |01⟩: site A in |0⟩, site B in |1⟩
        Evolution pop = Evolve.of(h).over(0, T).tolerance(1e-10).state(psi0).sampleAt(times)
                .monitor(progress(log, "populations")).run();
        Timeline traj = pop.timeline();
        Report.Plot pp = Report.plot("populations.png", "Populations from |01⟩ (closed system)", "t",
                "population");
        String[] labels = {"|00⟩", "|01⟩", "|10⟩", "|11⟩"};
        double[] tt = traj.times();
        for (int b = 0; b < 4; b++) {
            double[] p = new double[traj.size()];
            for (int k = 0; k < p.length; k++) {
                p[k] = traj.state(k).probability(b);
            }
            pp.line(labels[b], tt, p);
        }
        fig.put("final population |10⟩", fix(pop.state().probability(2)));
        rep.heading("Gate fidelity and populations");
        rep.paragraph("Average gate fidelity of the closed-system propagator to the target (Nielsen 2002): "
                + fig.get("gate fidelity (closed)") + ". Starting in |01⟩ the excitation moves to |10⟩ with final "
                + "population " + fig.get("final population |10⟩") + "; the detunings make the transfer incomplete.");
        rep.figure(pp);

        // 6. open system
        log.accept("[6/7] Open system");
        Lindbladian l = lindbladian();
        Evolution chRun = Evolve.of(l).over(0, T).tolerance(1e-10).monitor(progress(log, "channel")).run();
        Superoperator channel = chRun.channel();
        double fOpen = Fidelity.averageGate(target, channel);
        fig.put("gate fidelity (open)", fix(fOpen));
        fig.put("channel trace error", sci(Checks.traceError(channel)));
        fig.put("channel Choi minimum eigenvalue", sci(Checks.choiMinEigenvalue(channel)));
        Evolution dens = Evolve.of(l).over(0, T).tolerance(1e-10).density(psi0.toDensity()).sampleAt(times)
                .monitor(progress(log, "density")).run();
        Timeline dt = dens.timeline();
        double[] purity = Fidelity.purity(dt), entropy = Fidelity.entropy(dt);
        fig.put("final purity", fix(purity[purity.length - 1]));
        fig.put("final entropy", fix(entropy[entropy.length - 1]));
        Report.Plot pe = Report.plot("purity-entropy.png", "Open system from |01⟩: purity and entropy", "t",
                "purity tr ρ², entropy (nats)");
        pe.line("purity", dt.times(), purity).line("von Neumann entropy", dt.times(), entropy);
        rep.heading("Open system (weak relaxation)");
        rep.paragraph("Dynamical map over [0, T] (" + chRun.scheme().name() + ", adaptive, tolerance 1e-10): trace "
                + "error " + fig.get("channel trace error") + ", smallest Choi eigenvalue "
                + fig.get("channel Choi minimum eigenvalue") + " (completely positive "
                + (Checks.isCompletelyPositive(channel) ? "within" : "NOT within") + " tolerance), average gate "
                + "fidelity to the target " + fig.get("gate fidelity (open)") + " (closed system: "
                + fig.get("gate fidelity (closed)") + "). From |01⟩ the purity falls to " + fig.get("final purity")
                + " and the entropy rises to " + fig.get("final entropy") + " nats.");
        rep.figure(pe);

        // 7. summary of figures
        log.accept("[7/7] Writing the report to " + folder);
        TextTable ft = new TextTable("figure", "value");
        fig.forEach(ft::add);
        rep.heading("Figures");
        rep.table(ft.markdown());
        return new Outcome(rep.write(folder), Map.copyOf(fig));
    }
}
