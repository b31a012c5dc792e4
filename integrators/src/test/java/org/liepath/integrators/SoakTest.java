package org.liepath.integrators;

import org.junit.jupiter.api.Test;
import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;
import org.liepath.testing.Seeds;

import java.util.Locale;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

/**
 * Long runs: accumulated rounding of structure-preserving steps stays at the rounding level.
 *
 * <p>Runs only with {@code -Dliepath.soak=true} (the {@code soak} Maven profile); {@code -Dliepath.soak.steps=N}
 * bounds the step counts (CI runs a bounded form; the profile's default is 10⁶ steps). The figures are printed so the
 * CI log records them next to the Runge–Kutta reference's drift on the same problems.
 *
 * <p>Budgets. Storing U in double precision rounds each of its 2n² real entries once per step, a random walk
 * that leaves ‖U†U − I‖_F ≈ 2u·sqrt(n·N) (u = 2⁻⁵³): ≈ 3e-13 for the qubit and ≈ 9e-13 for 16 levels after
 * N = 10⁶ steps; so 1e-12 is met only if nothing else grows faster. Something did: an exponential factor with
 * order-one entries is itself rounded to ~u, and with a slowly varying Hamiltonian that rounding is nearly the same
 * every step, so its non-unitary part added up linearly (16 levels, CF4:2: 2.5e-12 after 10⁵ steps, 2.5e-11 after
 * 10⁶). The kernels therefore apply each factor in increment form X ← X + (e^Ω − I)X with e^Ω − I evaluated
 * directly (errors u·‖Ω‖; E. Hairer, C. Lubich, G. Wanner, Geometric Numerical Integration, 2nd ed., Springer
 * 2006, §VIII.5 on reducing round-off in long integrations), which leaves the random walk. Measured with dt = 1e-3
 * (this machine, 2026): 16 levels, CF4:2: 3.9e-14 / 1.3e-13 / 3.9e-13 after 10⁴ / 10⁵ / 10⁶ steps; qubit,
 * CF4:3Opt: 3.1e-14 / 4.4e-15 / 2.9e-13. Hence the budget 1e-12 for both. The reference integrator has no such
 * property: its defect grows like its local error times the number of steps.
 */
class SoakTest {
    private static final int STEPS = Integer.getInteger("liepath.soak.steps", 1_000_000);

    static boolean soak() {
        return Boolean.getBoolean("liepath.soak");
    }

    private static double unitarityDefect(Operator u) {
        return u.dagger().times(u).minus(Operator.identity(u.dim())).norm();
    }

    private static void report(String what, double value, double referenceValue) {
        System.out.println(String.format(Locale.ROOT, "SOAK %-44s %.3e   (Runge–Kutta reference: %.3e)", what, value,
                referenceValue));
    }

    @Test
    void drivenQubitKeepsUnitarityOverManySteps() {
        assumeTrue(soak(), "soak runs only with -Psoak");
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), Drive.cosine(0.4, 1.0)).build();
        double dt = 1e-3, t1 = STEPS * dt;
        Operator u = stepThrough(Scheme.commutatorFree4Opt(), h, 2, dt, STEPS);
        double defect = unitarityDefect(u);
        Evolution ref = Evolve.of(h).over(0, t1).scheme(Scheme.reference()).tolerance(1e-10).maxSteps(50_000_000L).run();
        double refDefect = ref.status().isSuccess() ? unitarityDefect(ref.propagator()) : Double.NaN;
        report("qubit, CF4:3Opt, " + STEPS + " steps, unitarity", defect, refDefect);
        assertTrue(defect <= 1e-12, "unitarity defect " + defect);
    }

    @Test
    void sixteenLevelSystemKeepsUnitarityOverManySteps() {
        assumeTrue(soak(), "soak runs only with -Psoak");
        Random r = new Random(16);
        Operator h0 = Seeds.randomHermitian(r, 16), h1 = Seeds.randomHermitian(r, 16);
        Hamiltonian h = Hamiltonian.builder(16).term(0.2, h0).term(h1, Drive.cosine(0.05, 1.3)).build();
        double dt = 1e-3;
        Operator u = stepThrough(Scheme.commutatorFree4(), h, 16, dt, STEPS);
        double defect = unitarityDefect(u);
        int refSteps = Math.min(STEPS, 200_000);
        Evolution ref = Evolve.of(h).over(0, refSteps * dt).scheme(Scheme.reference()).tolerance(1e-10)
                .maxSteps(50_000_000L).run();
        double refDefect = ref.status().isSuccess() ? unitarityDefect(ref.propagator()) : Double.NaN;
        report("16 levels, CF4:2, " + STEPS + " steps, unitarity", defect, refDefect);
        assertTrue(defect <= 1e-12, "unitarity defect " + defect);
    }

    @Test
    void openSystemKeepsTraceOverManySteps() {
        assumeTrue(soak(), "soak runs only with -Psoak");
        int steps = Math.min(STEPS, 100_000);
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, Pauli.z()).term(Pauli.x(), Drive.cosine(0.3, 1.0)).build();
        Lindbladian l = Lindbladian.builder(h).jump(0.05, Operator.unit(2, 0, 1)).jump(0.02, Pauli.z()).build();
        Stepper s = Scheme.commutatorFree4Opt().stepper(l);
        // vec(ρ0) for ρ0 = |+⟩⟨+|, column stacking, planar layout: 4 real parts then 4 imaginary parts
        double[] v = {0.5, 0.5, 0.5, 0.5, 0, 0, 0, 0};
        double dt = 1e-2;
        for (int k = 0; k < steps; k++) {
            s.advance(k * dt, dt, v);
        }
        double drift = Math.hypot(v[0] + v[3] - 1, v[4] + v[7]);
        Operator rho0 = Operator.real(new double[][]{{0.5, 0.5}, {0.5, 0.5}});
        Evolution ref = Evolve.of(l).over(0, steps * dt).scheme(Scheme.reference()).tolerance(1e-10).density(rho0)
                .maxSteps(50_000_000L).run();
        double refDrift = ref.status().isSuccess() ? Math.abs(ref.density().trace().getReal() - 1) : Double.NaN;
        report("qubit GKLS, CF4:3Opt, " + steps + " steps, |tr ρ − 1|", drift, refDrift);
        assertTrue(drift <= 1e-12, "trace drift " + drift);
    }

    private static Operator stepThrough(Scheme scheme, Hamiltonian h, int n, double dt, int steps) {
        Stepper s = scheme.stepper(h);
        double[] u = new double[2 * n * n];
        for (int i = 0; i < n; i++) {
            u[i * n + i] = 1;
        }
        for (int k = 0; k < steps; k++) {
            s.advance(k * dt, dt, u);
        }
        double[] re = new double[n * n], im = new double[n * n];
        System.arraycopy(u, 0, re, 0, n * n);
        System.arraycopy(u, n * n, im, 0, n * n);
        return Operator.ofPlanar(n, re, im);
    }
}
