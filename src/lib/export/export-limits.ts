/**
 * Every cap on what one export may cost, and the worker pool that builds the heavy ones, in one
 * place. docs/exports.md ("Limits") lists the same numbers; change both together.
 * Pure: the Export panel reads the caps too.
 */

export const EXPORT_LIMITS = {
  /** Most pages in one paper template PDF. */
  maxPages: 200,
  /**
   * Longest side of any PDF page, pt: 14,400 pt = 200 in = 5,080 mm, the largest page size
   * ISO 32000-1 annex C (implementation limits) allows. A `fit` template longer than this tiles
   * onto pages no larger.
   */
  maxPageSidePt: 14_400,
  /**
   * Most drawn primitives (lines, outlines, circles, labels, page-map cells) in one file, counted
   * over every page. The largest valid design on the most pages stays under it.
   */
  maxPrimitives: 250_000,
  /** Largest estimated file, bytes (32 MiB). */
  maxBytes: 32 * 1024 * 1024,
} as const;

/** The worker pool that builds PDFs off the request thread (export-pool.server.ts). */
export const EXPORT_POOL = {
  /**
   * Worker threads of one process when EXPORT_THREADS is not set: one core is left to the web
   * server; at most 4, as each may hold a large PDF. Several processes on one machine share its
   * cores: APP_PROCESS_CORES gives each its share (npm run cluster does: cores ÷ processes), and
   * the threads are worked out from that share; EXPORT_THREADS sets them outright.
   */
  threads: (cores: number): number => Math.min(4, Math.max(1, cores - 1)),
  /**
   * Jobs waiting for a thread beyond those running; one more is answered 503. Eight of the
   * largest allowed templates (a few seconds each here) still finish within the time limit.
   */
  maxQueue: 8,
  /** A job still queued or running this long after it was asked for is stopped (504), ms. */
  jobTimeoutMs: 120_000,
  /** Retry-After on a 503 for a full queue, seconds. */
  retryAfterSeconds: 10,
  /** Heap limit of one worker thread, MiB: a runaway job ends its own worker, not the server. */
  workerHeapMb: 1024,
} as const;

/** How an export refusal is answered: 422, the request is well formed but asks for too much. */
export const TOO_LARGE_STATUS = 422;
