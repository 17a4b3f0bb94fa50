/**
 * File rules every package shares: what an output path may replace ({@link org.lagmill.io.OutputTargets}), how a whole
 * file is written ({@link org.lagmill.io.AtomicFiles}), the one CRC32C ({@link org.lagmill.io.Crc32c}), JSON files
 * that carry their own checksum ({@link org.lagmill.io.SealedJson}) and CSV output cells
 * ({@link org.lagmill.io.CsvCells}).
 * Depends on no other lagmill package, so every stage (the scenario generator included) may use it.
 */
package org.lagmill.io;
