/**
 * Screen calibration for "1:1 on screen": a bar drawn 100 mm long by the browser's reckoning;
 * the user measures it with a ruler and enters what they see.
 */
import { useId, useState } from 'react';
import { BUTTON, FIELD_ERROR, INPUT, PRIMARY_BUTTON } from './control-styles.ts';
import { parseNumber } from './design-draft.ts';
import { CALIBRATION_BAR_MM, measurementProblem, pxPerMmFromMeasurement } from './screen-calibration.ts';
import { CSS_PX_PER_MM } from './view-transform.ts';

interface CalibrationPanelProps {
  pxPerMm: number;
  calibrated: boolean;
  onSave: (pxPerMm: number) => void;
  onClose: () => void;
}

export function CalibrationPanel({ pxPerMm, calibrated, onSave, onClose }: CalibrationPanelProps) {
  const inputId = useId();
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const save = () => {
    const measured = parseNumber(text) ?? Number.NaN;
    const found = measurementProblem(measured);
    setProblem(found);
    if (found === null) onSave(pxPerMmFromMeasurement(measured));
  };
  return (
    <section aria-labelledby="calibration-title" className="space-y-2 rounded border border-spruce bg-white p-3">
      <h2 id="calibration-title" className="font-semibold">Screen calibration</h2>
      <p className="text-sm">
        Measure the bar below with a ruler, at the screen, and enter its length. "1:1 on screen" then draws the board
        at its real size on this screen. The result is kept in this browser.
      </p>
      <div className="overflow-x-auto py-2">
        <div
          aria-label={`Calibration bar, nominally ${CALIBRATION_BAR_MM} mm long`}
          role="img"
          className="h-4 border-x-2 border-ink bg-ink-soft"
          style={{ width: `${CALIBRATION_BAR_MM * CSS_PX_PER_MM}px` }}
        />
      </div>
      <div>
        <label htmlFor={inputId} className="block text-sm">Measured length of the bar (mm)</label>
        <div className="flex max-w-sm gap-2">
          <input
            id={inputId}
            type="text"
            inputMode="decimal"
            className={INPUT}
            value={text}
            aria-invalid={problem !== null}
            aria-describedby={problem ? 'error-calibration' : undefined}
            onChange={(event) => setText(event.target.value)}
          />
          <button type="button" className={PRIMARY_BUTTON} onClick={save}>Save calibration</button>
          <button type="button" className={BUTTON} onClick={onClose}>Close</button>
        </div>
        {problem && <p id="error-calibration" className={FIELD_ERROR}>{problem}</p>}
      </div>
      <p className="text-xs text-ink-soft" role="status">
        {calibrated
          ? `Calibrated: ${pxPerMm.toFixed(3)} screen px per mm.`
          : 'Not calibrated yet: 1:1 assumes the browser’s nominal 96 px per inch.'}
      </p>
    </section>
  );
}
