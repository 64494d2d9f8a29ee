/**
 * A failed check's likely cause in a few words, above the chart: what a person looks for first
 * (a template made for another scale, one shifted at the nut, or single slots off).
 */
import { formatLength } from '~/lib/format/units';
import type { CheckResult, Diagnosis } from '~/lib/template-check/compare';

/** Edges are named only on a fanned template, where each edge is checked on its own. */
function edge(string: number, strings: number, fanned: boolean): string {
  if (!fanned) return '';
  return string === 1 ? ' (treble edge)' : ` (${string === strings ? 'bass edge' : `string ${string}`})`;
}

function headline(d: Exclude<Diagnosis, { kind: 'none' }>, result: CheckResult, strings: number, fanned: boolean): string {
  const where = edge(d.string, strings, fanned);
  if (d.kind === 'scale') return `Made for another scale${where}: best fit ${formatLength(d.scaleLength, result.units, true)}`;
  if (d.kind === 'offset') return `Shifted at the nut${where} by ${formatLength(d.offset, result.units, true)}`;
  return `Single slots off${where}`;
}

export function DiagnosisHeadlines({ result, strings, fanned }: { result: CheckResult; strings: number; fanned: boolean }) {
  const found = result.diagnoses.filter((d): d is Exclude<Diagnosis, { kind: 'none' }> => d.kind !== 'none');
  if (found.length === 0) return null;
  return (
    <ul aria-label="Likely cause" data-testid="check-diagnosis" className="space-y-1 font-semibold">
      {found.map((d) => (
        <li key={`${d.kind}-${d.string}`}>{headline(d, result, strings, fanned)}</li>
      ))}
    </ul>
  );
}
