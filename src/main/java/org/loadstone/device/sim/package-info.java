/**
 * Loadstone's built-in simulated load frame: a deterministic physical model, no I/O, no threads.
 *
 * <p>Chain, per model step (at most 100 µs, and exactly at every sample instant):
 *
 * <ol>
 *   <li>crosshead drive: constant rate, or a hand-pumped press (uneven strokes, pauses, slight
 *       back-off), giving the true crosshead displacement x (mm);
 *   <li>frame compliance: x − gap = δ + F(δ)/k_frame is solved for the specimen deflection δ;
 *   <li>specimen: force from the deflection history (toe, elastic, failure, post-failure
 *       envelope, elastic unloading and reloading);
 *   <li>load cell and 24-bit converter: counts = offset + s·F + terminal-line bow + Gaussian
 *       noise, rounded and clipped to −8 388 608…8 388 607; encoder counts = round(x·cpm);
 *   <li>converter timing: nominal period, optional rate error and jitter; wrapping u16 sequence
 *       and u32 microsecond device clock.
 * </ol>
 *
 * <p>Entry point: {@link org.loadstone.device.sim.SimulatedFrame#builder()}. Ground truth:
 * {@link org.loadstone.device.sim.SimulatedFrame#truth()} and the per-sample truth in {@link
 * org.loadstone.device.sim.SampleBlock} / {@link org.loadstone.device.sim.SimSample}. Random
 * numbers come from our own seeded generator with one stream per part (specimen scatter, drive,
 * noise, timing, failure), and all transcendental functions are {@link java.lang.StrictMath}, so
 * the same settings and seed give the same samples on any JVM. Preset numbers are illustrative,
 * not material data.
 */
package org.loadstone.device.sim;
