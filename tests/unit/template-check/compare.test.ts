import { Interval, Midi, Note } from 'tonal';
import { describe, expect, it } from 'vitest';
import { centsError, compareTemplate, defaultTolerance, type Measurement } from '~/lib/templates/check/compare.ts';
import { checkReference } from '~/lib/templates/check/reference.ts';
import { designOf } from '../../support/design-builders.ts';
import { expectNear } from '../../support/expect-near.ts';

const FRETS = Array.from({ length: 20 }, (_, i) => i + 1);

/** Closed form for 12-tone equal temperament: d(n) = L (1 - 2^(-n/12)). */
function closedForm(scaleLength: number, fret: number): number {
  return scaleLength * (1 - 2 ** (-fret / 12));
}

function measuredFor(scaleLength: number, offset = 0, noise: (fret: number) => number = () => 0): Measurement[] {
  return FRETS.map((fret) => ({ fret, along: 'string-1' as const, fromNut: closedForm(scaleLength, fret) + offset + noise(fret) }));
}

/** Deterministic pseudo-random numbers in [0, 1): a 32-bit linear congruential generator (Numerical Recipes constants). */
function lcg(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

const design635 = checkReference(designOf({ scale: { treble: 635, bass: 635 }, frets: 20, stringSpacing: { nut: 43, bridge: 56 } }));

describe('Template check against a design', () => {
  it('a template made for 628.65 mm fails against 635 mm and the best fit recovers 628.65 mm within 0.01 mm', () => {
    const outcome = compareTemplate(design635, measuredFor(628.65), defaultTolerance('cnc', 'mm'));
    if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
    const { result } = outcome;
    expect(result.passed).toBe(false);
    expectNear(result.fits[0]!.scale.scaleLength, 628.65, 0.01); // mm
    expect(result.fits[0]!.scale.maxAbsResidual).toBeLessThan(1e-9); // mm
    expect(result.diagnoses).toEqual([expect.objectContaining({ kind: 'scale', along: 'string-1' })]);
    expect(result.summary).toMatch(/^Fails: .* The slots fit a 628\.65 mm scale, not 635\.00 mm/); // no edge named on a single-scale board
    // Slots too close to the nut make the stopped string longer, so every fret plays flat.
    for (const slot of result.slots) expect(slot.cents).toBeLessThan(0);
  });

  it('the same measurements shifted +0.3 mm at the nut are reported as a constant offset', () => {
    const outcome = compareTemplate(design635, measuredFor(628.65, 0.3), defaultTolerance('cnc', 'mm'));
    if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
    const [diagnosis] = outcome.result.diagnoses;
    expect(outcome.result.passed).toBe(false);
    expect(diagnosis?.kind).toBe('offset');
    if (diagnosis?.kind !== 'offset') return;
    expectNear(diagnosis.offset, 0.3, 1e-9); // mm
    expectNear(diagnosis.scaleLength, 628.65, 1e-9); // mm
    expect(outcome.result.summary).toMatch(/shifted by a constant \+0\.30 mm/);
  });

  it('a pure +0.3 mm shift of the right scale is an offset, not another scale', () => {
    const outcome = compareTemplate(design635, measuredFor(635, 0.3), defaultTolerance('hand', 'mm'));
    if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
    expect(outcome.result.diagnoses[0]).toEqual(expect.objectContaining({ kind: 'offset' }));
  });

  it('seeded noise of ±0.02 mm passes at ±0.05 mm (CNC tolerance, common practice)', () => {
    for (const seed of [1, 7, 2026]) {
      const random = lcg(seed);
      const noise = () => (random() * 2 - 1) * 0.02;
      const outcome = compareTemplate(design635, measuredFor(635, 0, noise), defaultTolerance('cnc', 'mm'));
      if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
      expect(outcome.result.passed).toBe(true);
      expect(outcome.result.failing).toBe(0);
      expect(Math.abs(outcome.result.worstDeviation)).toBeLessThanOrEqual(0.02);
      expect(outcome.result.diagnoses).toEqual([{ kind: 'none' }]);
      expect(outcome.result.summary).toMatch(/^Passes: all 20 slots within ±0\.05 mm/);
    }
  });

  it('one slot cut 0.2 mm off is "scattered", and only that slot fails', () => {
    const measured = measuredFor(635).map((m) => (m.fret === 12 ? { ...m, fromNut: m.fromNut + 0.2 } : m));
    const outcome = compareTemplate(design635, measured, defaultTolerance('hand', 'mm'));
    if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
    expect(outcome.result.failing).toBe(1);
    expect(outcome.result.slots.find((s) => !s.withinTolerance)?.fret).toBe(12);
    expect(outcome.result.diagnoses[0]?.kind).toBe('scattered');
  });

  it('measurements along the outer strings of a fanned design use string 1 and string N scale lengths from the layout', () => {
    const reference = checkReference(
      designOf({ strings: 7, scale: { treble: 648, bass: 686 }, perpendicularFret: 8, frets: 20, stringSpacing: { nut: 48, bridge: 75 } }),
    );
    const measured: Measurement[] = [
      ...FRETS.map((fret) => ({ fret, along: 'string-1' as const, fromNut: closedForm(648, fret) })),
      ...FRETS.map((fret) => ({ fret, along: 'string-7' as const, fromNut: closedForm(680, fret) })),
    ];
    const outcome = compareTemplate(reference, measured, defaultTolerance('cnc', 'mm'));
    if (!outcome.ok) throw new Error(JSON.stringify(outcome.errors));
    const [treble, bass] = outcome.result.fits;
    expectNear(treble!.scale.scaleLength, 648, 1e-9); // mm
    expectNear(bass!.scale.scaleLength, 680, 1e-9); // mm
    expect(outcome.result.slots.filter((s) => s.along === 'string-1').every((s) => s.withinTolerance)).toBe(true);
    expect(outcome.result.diagnoses).toEqual([expect.objectContaining({ kind: 'scale', along: 'string-7' })]);
    // These were always compared along string 7; the summary now says so instead of "bass edge".
    expect(outcome.result.summary).toMatch(/slots along string 7 \(bass\) fit a 680\.00 mm scale/);
  });

  it('works in inches: default tolerances are the mm values converted', () => {
    expectNear(defaultTolerance('hand', 'in'), 0.1 / 25.4, 1e-15); // in
    const reference = checkReference(designOf({ units: 'in', scale: { treble: 13.875, bass: 13.875 }, frets: 20, stringSpacing: { nut: 0.85, bridge: 1.45 } }));
    const measured = FRETS.map((fret) => ({ fret, along: 'string-1' as const, fromNut: closedForm(13.875, fret) }));
    const outcome = compareTemplate(reference, measured, defaultTolerance('cnc', 'in'));
    expect(outcome.ok && outcome.result.passed).toBe(true);
  });

  it('refuses measurements for frets the design lacks, or past the saddle', () => {
    const outcome = compareTemplate(design635, [{ fret: 21, along: 'string-1', fromNut: 450 }, { fret: 3, along: 'string-1', fromNut: 700 }], 0.1);
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.errors.map((e) => e.field)).toEqual(['measurements.0', 'measurements.1.fromNut']);
  });
});

describe('cents error 1200 log2((L - d_design) / (L - d_measured))', () => {
  it('an octave is 1200 cents, by the definition of the cent (A. J. Ellis, 1885) and tonal Interval.semitones("8P") = 12', () => {
    // Vibrating length halved: (L - d_design) / (L - d_measured) = 2.
    expectNear(centsError(600, 0, 300), 1200, 1e-9); // cents
    expectNear(centsError(600, 0, 300), 100 * Interval.semitones('8P')!, 1e-9); // cents
    // One cent is the ratio 2^(1/1200) (Ellis).
    expectNear(centsError(1, 0, 1 - 1 / 2 ** (1 / 1200)), 1, 1e-9); // cents
  });

  it('agrees with the tonal library: midiToFreq(fret + cents / 100) is the pitch of the measured length', () => {
    const scale = 650;
    const openMidi = Midi.toMidi('A2')!;
    const openFreq = Note.freq('A2')!;
    for (const fret of [1, 5, 12, 19]) {
      for (const error of [-0.3, -0.05, 0.05, 0.3]) {
        const design = closedForm(scale, fret);
        const measured = design + error;
        const cents = centsError(scale, design, measured);
        // A stopped string's frequency is inversely proportional to its vibrating length.
        const measuredFreq = (openFreq * scale) / (scale - measured);
        expectNear(Midi.midiToFreq(openMidi + fret + cents / 100), measuredFreq, 1e-9); // Hz
        expect(Math.sign(cents)).toBe(Math.sign(error));
      }
    }
  });
});
