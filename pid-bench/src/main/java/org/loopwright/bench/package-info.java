/**
 * JMH benchmarks of the controller update: per form, per discretisation method, the full-featured
 * configuration beside {@link org.loopwright.bench.BareRecurrence} (the same arithmetic on plain
 * fields, the limit), the variable-period update, a bank of 1,000 controllers and one closed-loop
 * simulation step. Every benchmark returns its result so the JIT keeps the work.
 */
package org.loopwright.bench;
