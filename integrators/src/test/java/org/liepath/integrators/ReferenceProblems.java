package org.liepath.integrators;

import org.liepath.core.Drive;
import org.liepath.core.Hamiltonian;
import org.liepath.core.Operator;
import org.liepath.core.Pauli;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;

/**
 * Time-dependent problems with propagators known from outside the project, shared by the integrator tests. Each
 * factory names the source of its reference value. Conventions: ħ = 1, dU/dt = −i H(t) U, basis |0⟩ = (1,0)ᵀ with
 * σz|0⟩ = +|0⟩, Pauli strings with qubit 0 leftmost.
 */
final class ReferenceProblems {
    private ReferenceProblems() {
    }

    /** A Hamiltonian on [t0, t1] with its reference propagator U(t1, t0) and the accuracy of that reference. */
    record Problem(String name, Hamiltonian h, double t0, double t1, Operator exact, double referenceAccuracy) {
        @Override
        public String toString() {
            return name;
        }
    }

    static final Operator X = Pauli.x(), Y = Pauli.y(), Z = Pauli.z();

    /**
     * Rabi problem with a rotating drive, case R1: H = (ω0/2)σz + (Ω/2)[cos(ωt)σx + sin(ωt)σy], ω0 = 1, Ω = 0.3,
     * ω = 0.9, t ∈ [0, 10]. Exact propagator U(t) = exp(−iωtσz/2)·exp(−it[(ω0−ω)/2 σz + (Ω/2)σx]) (rotating frame;
     * I. I. Rabi, Phys. Rev. 51, 652 (1937); C. J. Foot, Atomic Physics (OUP 2005), eqs. (7.41)–(7.46)), evaluated
     * here in closed form; the tabulated U(10) (computed independently with mpmath) is checked in the tests too.
     */
    static Problem rabi(double omega0, double rabi, double omega, double t1) {
        Hamiltonian h = Hamiltonian.builder(2)
                .term(omega0 / 2, Z)
                .term(X, Drive.cosine(rabi / 2, omega))
                .term(Y, Drive.sine(rabi / 2, omega, 0))
                .build();
        return new Problem("Rabi rotating drive", h, 0, t1, rabiExact(omega0, rabi, omega, t1), 1e-15);
    }

    /** The closed-form rotating-frame propagator of {@link #rabi} at time t. */
    static Operator rabiExact(double omega0, double rabi, double omega, double t) {
        Operator frame = Exact.su2Exp(0, 0, 0, omega / 2, t);
        Operator inFrame = Exact.su2Exp(0, rabi / 2, 0, (omega0 - omega) / 2, t);
        return frame.times(inFrame);
    }

    /**
     * Linearly polarised drive without the rotating-wave approximation: H = (Δ/2)σz + Ω cos(ωt)σx, Δ = 1, Ω = 0.4,
     * ω = 1, t ∈ [0, 5]; U(5) computed independently with mpmath (18 digits tabulated).
     */
    static Problem linearDrive() {
        Hamiltonian h = Hamiltonian.builder(2).term(0.5, Z).term(X, Drive.cosine(0.4, 1.0)).build();
        Operator u = Exact.fromPairs(2, new double[][]{
                {-0.504100878292618678, -0.292030392796226583}, {-0.571262608157240247, 0.578151871664599433},
                {0.571262608157240247, 0.578151871664599433}, {-0.504100878292618678, 0.292030392796226583}});
        return new Problem("linear drive (no RWA), [0,5]", h, 0, 5, u, 1e-17);
    }

    /** The same Hamiltonian as {@link #linearDrive} on [0, 10]; U(10) computed independently with mpmath. */
    static Problem linearDriveLong() {
        Hamiltonian h = linearDrive().h();
        Operator u = Exact.fromPairs(2, new double[][]{
                {-0.17942193503183345, -0.454411643739364262}, {0.823737704576317529, -0.287704746785417248},
                {-0.823737704576317529, -0.287704746785417248}, {-0.17942193503183345, 0.454411643739364262}});
        return new Problem("linear drive (no RWA), [0,10]", h, 0, 10, u, 1e-16);
    }

    /**
     * Two qubits: H = 0.5 ZI + 0.35 IZ + 0.25 ZZ + 0.3 cos(1.1t)(XI + IX), t ∈ [0, 5], basis |00⟩,|01⟩,|10⟩,|11⟩;
     * U(5) computed independently with mpmath (15 digits tabulated; SciPy's DOP853 at rtol 1e-13 agrees to 7e-15).
     */
    static Problem twoQubit() {
        Operator xs = Pauli.string("XI").plus(Pauli.string("IX"));
        Hamiltonian h = Hamiltonian.builder(4)
                .term(0.5, Pauli.string("ZI")).term(0.35, Pauli.string("IZ")).term(0.25, Pauli.string("ZZ"))
                .term(xs, Drive.cosine(0.3, 1.1)).build();
        Operator u = Exact.fromPairs(4, new double[][]{
                {0.530674990747588, 0.328334197634917}, {0.481186936839273, -0.24939469673859},
                {0.499452790312531, 0.122288162533346}, {-0.19470272126088, -0.12052174824172},
                {0.0847395910692177, -0.523540445645144}, {0.577141612092448, 0.440868300913766},
                {-0.201980647642352, -0.16440398462542}, {-0.281548089516693, -0.210174036043005},
                {0.435364395239593, -0.224534981254047}, {-0.194507567847571, -0.200513066828178},
                {-0.463525553992438, 0.656024974853693}, {-0.0871569166951909, -0.170827886097358},
                {0.0131891994822694, 0.298618892412242}, {-0.266266807265303, 0.172821935310792},
                {-0.128151068539455, -0.078232091669057}, {-0.857941807905617, 0.226451464664281}});
        return new Problem("two qubits, [0,5]", h, 0, 5, u, 2e-15);
    }

    /**
     * A driven three-level ladder of our own invention: H = diag(0, 1, 2.3) + 0.3 cos(1.1t)(|0⟩⟨1| + h.c.)
     * + 0.2 sin(0.7t)(|1⟩⟨2| + h.c.) + 0.15 cos(1.7t + 0.4)(|0⟩⟨2| + h.c.), t ∈ [0, 6]. U(6) computed
     * independently with mpmath.odefun at 30 digits (script reference/three_level.py, data reference/three_level.txt;
     * SciPy's DOP853 at rtol 1e-13 agrees to 3e-13).
     */
    static Problem threeLevel() {
        Operator x01 = Operator.unit(3, 0, 1).plus(Operator.unit(3, 1, 0));
        Operator x12 = Operator.unit(3, 1, 2).plus(Operator.unit(3, 2, 1));
        Operator x02 = Operator.unit(3, 0, 2).plus(Operator.unit(3, 2, 0));
        Hamiltonian h = Hamiltonian.builder(3)
                .term(1.0, Operator.diagonal(0, 1, 2.3))
                .term(x01, Drive.cosine(0.3, 1.1))
                .term(x12, Drive.sine(0.2, 0.7, 0))
                .term(x02, Drive.cosine(0.15, 1.7, 0.4))
                .build();
        return new Problem("three-level ladder, [0,6]", h, 0, 6, readMatrix("reference/three_level.txt", 3), 1e-19);
    }

    /** Landau–Zener H = (αt/2)σz + (Δ/2)σx on [−T, T]. */
    static Hamiltonian landauZener(double alpha, double delta) {
        return Hamiltonian.builder(2).term(Z, (Drive) t -> alpha * t / 2).term(delta / 2, X).build();
    }

    /** Reads "i j re im" lines (comments start with #) into an n×n operator. */
    static Operator readMatrix(String resource, int n) {
        double[] re = new double[n * n], im = new double[n * n];
        try (InputStream in = ReferenceProblems.class.getClassLoader().getResourceAsStream(resource)) {
            if (in == null) {
                throw new IllegalStateException("missing test resource " + resource);
            }
            BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            for (String line; (line = r.readLine()) != null; ) {
                if (line.isBlank() || line.startsWith("#")) {
                    continue;
                }
                String[] f = line.trim().split("\\s+");
                int i = Integer.parseInt(f[0]), j = Integer.parseInt(f[1]);
                re[i * n + j] = Double.parseDouble(f[2]);
                im[i * n + j] = Double.parseDouble(f[3]);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return Operator.ofPlanar(n, re, im);
    }
}
