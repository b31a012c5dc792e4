// Liepath example session (run as a test, so it stays in step with the API).
// Run it after the start-up file:
//   jshell --class-path validation/target/liepath-all.jar --startup DEFAULT \
//          --startup validation/src/main/jshell/liepath-startup.jsh validation/src/main/jshell/example.jsh

// 1. An operator set: two qubits, local Z fields, an exchange coupling and a local X drive.
var zi = Pauli.string("ZI");
var iz = Pauli.string("IZ");
var exchange = Pauli.string("XX").plus(Pauli.string("YY")).scale(0.5);
var xi = Pauli.string("XI");

// 2. The dynamical Lie algebra of the coupling part, and of the whole set.
var small = LieAlgebra.generatedBy(List.of(zi, iz, exchange));
var full = LieAlgebra.generatedBy(List.of(zi, iz, exchange, xi));
System.out.println("coupling part: dimension " + small.dimension() + ", type " + small.type());
System.out.println("with the drive: dimension " + full.dimension() + ", type " + full.type());

// 3. A time-dependent Hamiltonian and an evolution with a fourth-order Magnus scheme.
// (the jshell tool runs a line as soon as it is a complete statement: continued lines end with an open operator)
var h = Hamiltonian.builder(4).term(0.05, zi).term(-0.03, iz).
        term(exchange, Drive.gaussian(0.4, 5.0, 1.5)).term(xi, Drive.cosine(0.02, 0.5)).build();
var run = Evolve.of(h).over(0, 10).scheme(Scheme.magnus4()).steps(200).run();
System.out.println(run.status());
var u = run.propagator();

// 4. Validation: unitarity, agreement with the reference integrator, Magnus series.
System.out.println("unitarity error " + Checks.unitarityError(u));
if (!Checks.isUnitary(u)) throw new IllegalStateException("propagator not unitary");
var cc = CrossCheck.of(h).over(0, 10).scheme(Scheme.magnus4(), 200).scheme(Scheme.commutatorFree4Opt()).run();
System.out.println(cc);
var ms = MagnusSeries.of(h, 0, 10);
System.out.println(ms);
System.out.println("average gate fidelity, truncated Magnus series vs Magnus-4 run: " +
        Fidelity.averageGate(ms.propagator(4), u));
/exit
