/**
 * The simulated load frame's physical model: load cell, bridge amplifier and converter, crosshead
 * drive and frame compliance, and the specimens of each scenario. Deterministic: the same seed gives
 * the same samples. {@code device.SimTransport} turns its samples into the firmware's bytes.
 */
package org.loadstone.sim;
