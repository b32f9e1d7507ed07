/**
 * Displacement from a clip: decoding (FFmpeg through JavaCPP, or a folder of numbered images),
 * marker tracking by normalised cross-correlation, scale from two points a known distance apart,
 * sync to a force record, and the resulting position table. Core: no JavaFX, no port.
 */
package org.loadstone.video;
