/**
 * JMH benchmarks, run on demand with {@code java -jar benchmarks/target/benchmarks.jar}. Each reports a ratio
 * against its comparator measured in the same run.
 */
package org.liepath.benchmarks;
