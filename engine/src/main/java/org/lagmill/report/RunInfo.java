package org.lagmill.report;

import java.time.Instant;

/**
 * How and where a run was made. Every field may be null when unknown.
 *
 * @param created when the run finished, UTC
 * @param lagmillVersion the version that produced the run
 * @param commandLine the command as typed, arguments separated by single spaces
 * @param availableCores processors the JVM saw
 * @param maxHeapBytes the JVM's maximum heap in bytes
 * @param storePath the sales store the run read
 */
public record RunInfo(
    Instant created,
    String lagmillVersion,
    String commandLine,
    Integer availableCores,
    Long maxHeapBytes,
    String storePath) {}
