/**
 * Quick picks for the board radius: the common fingerboard radii, 7.25 in to 20 in
 * (184–508 mm; from memory, common practice), written into the nut or last-fret radius field in
 * the draft's units. Buttons, so they are reachable with Tab and work with Enter or Space.
 */
import { formatLength, fromMm, inToMm, type LengthUnit } from '~/lib/format/units.ts';
import { BUTTON } from './control-styles.ts';

export const COMMON_RADII_IN = [7.25, 9.5, 10, 12, 14, 16, 20] as const;

export function RadiusPicks({ units, onPick }: { units: LengthUnit; onPick: (field: 'radius.nut' | 'radius.end', text: string) => void }) {
  const text = (inches: number) => (units === 'in' ? String(inches) : formatLength(fromMm(inToMm(inches), 'mm'), 'mm'));
  return (
    <div className="space-y-1 text-xs">
      {(['radius.nut', 'radius.end'] as const).map((field) => (
        <div key={field} role="group" aria-label={`Common radii for the radius ${field === 'radius.nut' ? 'at the nut' : 'at the last fret'}`} className="flex flex-wrap items-center gap-1">
          <span>{field === 'radius.nut' ? 'At the nut:' : 'At the last fret:'}</span>
          {COMMON_RADII_IN.map((inches) => (
            <button key={inches} type="button" className={BUTTON} onClick={() => onPick(field, text(inches))}>
              {inches} in{units === 'mm' ? ` (${text(inches)} mm)` : ''}
            </button>
          ))}
        </div>
      ))}
      <p className="text-ink-soft">Common radii, from memory (common practice); a larger radius at the last fret makes a compound board.</p>
    </div>
  );
}
