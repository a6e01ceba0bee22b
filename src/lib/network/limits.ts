/**
 * Network size limits, in one place (the schema, the server's admission checks, the editor and
 * the job queue all read these).
 *
 * - ELEMENT_LIMIT: the largest network Polewise accepts at all (issue 15: extracted RC networks
 *   and lumped lines up to 100,000 elements; the sparse back end analyzes them in seconds).
 * - INTERACTIVE_ELEMENT_LIMIT: above this, an analysis is not run inside a request but queued as
 *   a background job with progress and cancel (src/lib/server/jobs/large-analysis.ts), and the
 *   editor shows the netlist view instead of mounting every symbol on the canvas.
 */
export const ELEMENT_LIMIT = 100_000;
export const INTERACTIVE_ELEMENT_LIMIT = 3000;
