/**
 * The plain records that the repair history keeps: board models, units, cases and what was
 * measured, suspected, done and noted during a case.
 *
 * <p>Every record that can travel between benches carries a stable id (a UUID string). Times are
 * {@link java.time.Instant}s kept to the millisecond. Optional text is an empty string, never null;
 * the few optional values that are not text (a closing time, an outcome, a frequency) are null when
 * absent, as their Javadoc says.
 */
package com.stagewise.history.record;
