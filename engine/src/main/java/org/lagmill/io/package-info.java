/**
 * File-writing rules every package shares: what an output path may replace ({@link org.lagmill.io.OutputTargets}).
 * Depends on no other lagmill package, so every stage (the scenario generator included) may use it.
 */
package org.lagmill.io;
