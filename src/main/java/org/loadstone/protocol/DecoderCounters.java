package org.loadstone.protocol;

/**
 * What a {@link StreamDecoder} has seen so far.
 *
 * @param samples samples delivered
 * @param messages non-sample records delivered
 * @param checksumErrors well-formed records whose CRC did not match
 * @param resyncs times bytes were discarded to find the next record
 * @param dropped samples missing from the sequence (gaps), whatever the cause
 * @param unknown records with a valid CRC but an unknown tag or type, skipped
 * @param bytes bytes fed in
 */
public record DecoderCounters(
    long samples, long messages, long checksumErrors, long resyncs, long dropped, long unknown,
    long bytes) {}
