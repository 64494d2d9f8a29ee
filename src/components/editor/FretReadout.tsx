/**
 * Per-string distances of the fret under the pointer (or the last one tapped, or the keyboard
 * cursor's). Not a live region: the drawing announces the keyboard cursor's place itself, once.
 */
import { formatLength } from '~/lib/format/units.ts';
import type { Layout } from '~/lib/geometry/layout.ts';

export function FretReadout({ layout, fret }: { layout: Layout; fret: number | null }) {
  const shown = layout.frets.find((candidate) => candidate.number === fret);
  const units = layout.units;
  return (
    <section aria-labelledby="fret-readout-title" className="rounded border border-paper-line bg-white p-3">
      <h2 id="fret-readout-title" className="text-sm font-semibold">
        {shown ? `Fret ${shown.number} readout` : 'Fret readout'}
      </h2>
      {shown ? (
        <table className="mt-1 w-full font-mono text-xs">
          <thead>
            <tr className="text-left text-ink-soft">
              <th scope="col" className="pr-2 font-normal">String</th>
              <th scope="col" className="pr-2 text-right font-normal">From nut ({units})</th>
              <th scope="col" className="text-right font-normal">From previous ({units})</th>
            </tr>
          </thead>
          <tbody>
            {shown.points.map((point) => (
              <tr key={point.string}>
                <th scope="row" className="pr-2 text-left font-normal">{point.string}</th>
                <td className="pr-2 text-right">{formatLength(point.fromNut, units)}</td>
                <td className="text-right">{formatLength(point.fromPrevious, units)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <p className="mt-1 text-xs text-ink-soft">Point at a fret in the drawing, or tap it, to read its distances on every string.</p>
      )}
    </section>
  );
}
