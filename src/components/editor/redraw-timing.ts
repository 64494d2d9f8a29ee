/**
 * Timing of one redraw (compute + draw) for `npm run bench`. Only active when the bench put a
 * `window.__kerflineBench` object on the page before the island loaded; otherwise every call is
 * a no-op. It reads performance.now() and nothing else.
 */

export interface RedrawSample {
  /** From the start of validating and computing the layout until React has committed the scene. */
  computeMs: number;
  /** Konva drawing the board layer (beforeDraw to draw events). */
  drawMs: number;
  totalMs: number;
}

declare global {
  interface Window {
    __kerflineBench?: { samples: RedrawSample[] };
  }
}

let pending: { startedAt: number; committedAt: number | null } | null = null;

function hook() {
  return typeof window === 'undefined' ? undefined : window.__kerflineBench;
}

/** Called when the layout computation for a changed design starts. */
export function redrawStarted(): void {
  if (hook()) pending = { startedAt: performance.now(), committedAt: null };
}

/** Called once the drawing's new scene is committed (before Konva draws it). */
export function redrawCommitted(): void {
  if (pending && pending.committedAt === null) pending.committedAt = performance.now();
}

/** Called after Konva drew the board layer, with the draw's own duration. */
export function redrawDrawn(drawMs: number): void {
  const target = hook();
  if (!target || !pending || pending.committedAt === null) return;
  const computeMs = pending.committedAt - pending.startedAt;
  target.samples.push({ computeMs, drawMs, totalMs: computeMs + drawMs });
  pending = null;
}
