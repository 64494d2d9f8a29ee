import { Midi } from 'tonal';
import { describe, expect, it } from 'vitest';
import { expectNear } from '../../support/expect-near.ts';
import { fretPoint, layoutOf } from '../../support/design-builders.ts';

const CHECKED_FRETS = [1, 2, 5, 7, 12, 17, 19, 22, 24];

/**
 * Closed form for 12-tone equal temperament, d(n) = L (1 - 2^(-n/12)), as published in
 * G. Varieschi and C. Gower, "Intonation and compensation of fretted string instruments",
 * Am. J. Phys. 78 (2010).
 */
function varieschiGowerDistance(scaleLength: number, fret: number): number {
  return scaleLength * (1 - 2 ** (-fret / 12));
}

describe('12-TET fret positions against Varieschi & Gower, Am. J. Phys. 78 (2010)', () => {
  const cases = [
    { label: '25.5 in', units: 'in' as const, scale: 25.5, spacing: 2, tolerance: 1e-12 },
    { label: '650 mm', units: 'mm' as const, scale: 650, spacing: 50, tolerance: 1e-10 },
  ];
  for (const { label, units, scale, spacing, tolerance } of cases) {
    it(`${label}: distance from the nut on every string at frets ${CHECKED_FRETS.join(', ')}`, () => {
      // Parallel strings: every string is exactly the scale length and x equals the distance.
      const layout = layoutOf({
        units,
        strings: 6,
        scale: { treble: scale, bass: scale },
        stringSpacing: { nut: spacing, bridge: spacing },
      });
      for (const fret of CHECKED_FRETS) {
        for (let string = 1; string <= 6; string++) {
          const point = fretPoint(layout, fret, string);
          expectNear(point.fromNut, varieschiGowerDistance(scale, fret), tolerance); // in design units
          expectNear(point.x, varieschiGowerDistance(scale, fret), tolerance);
        }
      }
    });

    it(`${label}: distance from the nut along the outer strings of a tapered board`, () => {
      const layout = layoutOf({
        units,
        scale: { treble: scale, bass: scale },
        stringSpacing: { nut: spacing, bridge: spacing * 1.4 },
      });
      for (const fret of CHECKED_FRETS) {
        expectNear(fretPoint(layout, fret, 1).fromNut, varieschiGowerDistance(scale, fret), tolerance);
        expectNear(fretPoint(layout, fret, 6).fromNut, varieschiGowerDistance(scale, fret), tolerance);
      }
    });
  }
});

describe('pitch check against the tonal music library (Midi.midiToFreq)', () => {
  it('frequency ratio of each fret to the open string equals L / (L - d) within 1e-9', () => {
    const scale = 648;
    const layout = layoutOf({ scale: { treble: scale, bass: 686 }, perpendicularFret: 8 });
    const openMidi = 64; // E4: any open-string note gives the same ratios
    for (let fret = 1; fret <= 24; fret++) {
      const point = fretPoint(layout, fret, 1);
      const tonalRatio = Midi.midiToFreq(openMidi + fret) / Midi.midiToFreq(openMidi);
      expectNear(scale / (scale - point.fromNut), tonalRatio, 1e-9); // dimensionless ratio
    }
  });
});

describe('octave and the 17.817 rule', () => {
  it('fret 12 is exactly half of every string (the 2:1 octave)', () => {
    const layout = layoutOf({ scale: { treble: 648, bass: 686 }, perpendicularFret: 8, strings: 7 });
    for (const string of layout.strings) {
      expect(fretPoint(layout, 12, string.index).fromNut).toBe(string.scaleLength / 2);
    }
  });

  it('fret 1 is L / 17.817 to 4 significant digits (the trade\'s 17.817 rule, common practice)', () => {
    for (const [units, scale] of [['mm', 650], ['mm', 628.65], ['in', 25.5], ['in', 24.75]] as const) {
      const layout = layoutOf({ units, scale: { treble: scale, bass: scale }, stringSpacing: { nut: 1, bridge: 1 } });
      const fretOne = fretPoint(layout, 1, 1).fromNut;
      expect(fretOne.toPrecision(4)).toBe((scale / 17.817).toPrecision(4));
    }
  });
});
