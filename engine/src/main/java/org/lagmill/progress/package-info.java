/**
 * The progress callback engine stages report through ({@link org.lagmill.progress.ProgressListener}); depends on
 * nothing. Rendering belongs to the CLI.
 */
package org.lagmill.progress;
