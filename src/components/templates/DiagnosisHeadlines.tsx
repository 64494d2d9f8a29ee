/**
 * A failed check's likely cause in a few words, above the chart: what a person looks for first
 * (a template made for another scale, one shifted at the nut, or single slots off).
 */
import { formatLength } from '~/lib/format/units.ts';
import type { CheckResult, Diagnosis } from '~/lib/templates/check/compare.ts';
import { measureLinePhrase, type MeasureLine } from '~/lib/templates/check/measure-lines.ts';

/** Lines are named where it matters: on a fanned board, or when more than one line was measured. */
function where(along: MeasureLine, strings: number, namedLines: boolean): string {
  return namedLines ? ` ${measureLinePhrase(along, strings)}` : '';
}

function headline(d: Exclude<Diagnosis, { kind: 'none' }>, result: CheckResult, strings: number, namedLines: boolean): string {
  const line = where(d.along, strings, namedLines);
  if (d.kind === 'scale') return `Made for another scale${line}: best fit ${formatLength(d.scaleLength, result.units, true)}`;
  if (d.kind === 'offset') return `Shifted at the nut${line} by ${formatLength(d.offset, result.units, true)}`;
  return `Single slots off${line}`;
}

export function DiagnosisHeadlines({ result, strings, namedLines }: { result: CheckResult; strings: number; namedLines: boolean }) {
  const found = result.diagnoses.filter((d): d is Exclude<Diagnosis, { kind: 'none' }> => d.kind !== 'none');
  if (found.length === 0) return null;
  return (
    <ul aria-label="Likely cause" data-testid="check-diagnosis" className="space-y-1 font-semibold">
      {found.map((d) => (
        <li key={`${d.kind}-${d.along}`}>{headline(d, result, strings, namedLines)}</li>
      ))}
    </ul>
  );
}
