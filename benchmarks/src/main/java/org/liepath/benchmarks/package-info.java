/**
 * JMH benchmarks and work–precision studies of Liepath (run on demand, never in the test suite).
 *
 * <ul>
 *   <li>{@link org.liepath.benchmarks.WorkPrecision}: error against CPU time for every fixed-step scheme and the
 *   Commons Math Dormand–Prince 8(5,3) comparator on three driven problems ({@code BenchProblems}), with the
 *   unitarity defect and the ratio at error 1e-10. Run with
 *   {@code java -cp benchmarks/target/benchmarks.jar org.liepath.benchmarks.WorkPrecision [problem…]}.</li>
 *   <li>{@link org.liepath.benchmarks.WorkPrecisionBenchmark}: one JMH benchmark per (problem, method) at the work
 *   tuned for error ≈ 1e-10; its {@code main} runs them in one session and prints the ratios.</li>
 *   <li>{@link org.liepath.benchmarks.StepperThroughput}: ns per {@code Stepper.advance} for 2×2 and 4×4 next to a
 *   flop model at the machine's FMA peak.</li>
 * </ul>
 * Build with {@code mvn -B -o -q -DskipTests package -pl benchmarks -am}; machines are shared, so read every figure
 * as rough and compare only within one run.
 */
package org.liepath.benchmarks;
