package org.loadstone.sim;

/**
 * What the simulated device says about itself (the identity a transport sends).
 *
 * @param adcKind {@code hx711} at 10 or 80 samples/s, else {@code fast}
 * @param rateHz nominal sample rate, samples/s
 * @param channels 2: load and position
 * @param positionCountsPerMm encoder counts per mm of crosshead travel
 * @param motorised whether the crosshead is driven (and obeys a halt)
 * @param name device name, no spaces
 * @param cellId the id of the frame's one load cell, no spaces
 * @param cellCapacity_N its rated capacity, N
 * @param cellCountsPerN its data-sheet sensitivity, counts per N
 */
public record FrameInfo(
    String adcKind,
    double rateHz,
    int channels,
    double positionCountsPerMm,
    boolean motorised,
    String name,
    String cellId,
    double cellCapacity_N,
    double cellCountsPerN) {}
