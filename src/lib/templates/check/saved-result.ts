/**
 * Saved Template checks are JSON written by whichever version of the check ran. Checks saved
 * before measurements named their line say `string: N` on each slot, fit and diagnosis: they were
 * compared along string N, so they are read as `along: 'string-N'` and keep their meaning.
 */
import type { CheckResult } from '~/lib/templates/check/compare.ts';
import type { MeasureLine } from '~/lib/templates/check/measure-lines.ts';

type Older = { string?: unknown; along?: unknown };

function alongOf(item: Older): MeasureLine {
  if (typeof item.along === 'string') return item.along as MeasureLine;
  return `string-${Number(item.string ?? 1)}`;
}

function upgrade<T extends object>(item: T): T & { along: MeasureLine } {
  const { string: _old, ...rest } = item as T & Older;
  return { ...(rest as T), along: alongOf(item as Older) };
}

/** A saved check's result in today's shape (older `string: N` fields become `along`). */
export function readSavedResult(raw: unknown): CheckResult {
  const result = raw as CheckResult;
  return {
    ...result,
    slots: result.slots.map(upgrade),
    fits: result.fits.map((fit) => {
      const upgraded = upgrade(fit);
      const factor = fit.scale.factor ?? fit.scale.scaleLength / fit.designScaleLength;
      const offsetFactor = fit.withOffset ? (fit.withOffset.factor ?? fit.withOffset.scaleLength / fit.designScaleLength) : 0;
      return { ...upgraded, scale: { ...fit.scale, factor }, withOffset: fit.withOffset ? { ...fit.withOffset, factor: offsetFactor } : null };
    }),
    diagnoses: result.diagnoses.map((d) => (d.kind === 'none' ? d : upgrade(d))),
  };
}
