/**
 * The one output format of every bench script (see bench/README.md): one JSON object per line
 * on stdout. scripts/bench.sh collects these lines into the table and bench/results/<time>.json.
 */
export interface Figure {
  /** What was measured, in plain words (unique within the run). */
  figure: string;
  value: number;
  /** Unit of `value`, e.g. "ms", "req/s", "ratio", "count", "KiB". */
  unit: string;
  /** The goal in words, e.g. ">= 0.8", "= 0", "baseline". */
  goal: string;
  /** Whether the goal is met; left out for figures that are context only (baselines). */
  met?: boolean;
}

export function reportFigure(figure: Figure): void {
  process.stdout.write(`${JSON.stringify(figure)}\n`);
}

/** The built server the runner started (BASE_URL), without a trailing slash. */
export function baseUrl(): string {
  const url = process.env.BASE_URL ?? process.env.TEST_APP_URL;
  if (!url) throw new Error('BASE_URL is not set: run bench scripts through `npm run bench`');
  return url.replace(/\/$/, '');
}

/** Seconds each load run lasts (BENCH_SECONDS, default 5). */
export function benchSeconds(): number {
  const seconds = Number(process.env.BENCH_SECONDS ?? '5');
  return Number.isFinite(seconds) && seconds > 0 ? seconds : 5;
}
