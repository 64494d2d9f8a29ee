/**
 * The demo instruments of the invented shop "Wrenfield Instrument Co.", offered as starting
 * presets in the editor and seeded as the demo shop's boards. The golden fret tables in
 * fixtures/tables are computed from these files.
 * Demo data: plausible values, not measurements of any real instrument.
 */
import { validateDesign, type Design } from '~/lib/schemas/design.ts';
import classical650 from './classical-650.json';
import mandolin from './mandolin.json';
import sevenStringFan from './seven-string-fan.json';
import shortScaleBass from './short-scale-bass.json';
import tenorUkulele from './tenor-ukulele.json';

export interface DemoDesign {
  /** File name in this folder without ".json"; stable, usable in URLs. */
  id: string;
  design: Design;
}

const SOURCES: Record<string, unknown> = {
  'seven-string-fan': sevenStringFan,
  'short-scale-bass': shortScaleBass,
  'classical-650': classical650,
  mandolin,
  'tenor-ukulele': tenorUkulele,
};

/** Every demo design, validated and with defaults filled in. */
export const DEMO_DESIGNS: readonly DemoDesign[] = Object.entries(SOURCES).map(([id, source]) => {
  const validation = validateDesign(source);
  if (!validation.ok) {
    const first = validation.issues[0];
    throw new Error(`demo design ${id} is invalid: ${first?.path}: ${first?.message}`);
  }
  return { id, design: validation.design };
});
