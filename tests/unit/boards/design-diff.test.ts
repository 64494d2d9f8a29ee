import { describe, expect, it } from 'vitest';
import { describeChange, diffDesigns, showValue } from '~/components/boards/design-diff.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';

const fan = () => structuredClone(DEMO_DESIGNS.find((d) => d.id === 'seven-string-fan')!.design);

describe('diffDesigns', () => {
  it('finds nothing between a design and its copy', () => {
    expect(diffDesigns(fan(), fan())).toEqual([]);
  });

  it('names each changed leaf by its dotted path with both values', () => {
    const after = fan();
    after.scale.bass = 690;
    after.perpendicularFret = 7;
    after.markers[4] = { fret: 12, kind: 'single' };
    expect(diffDesigns(fan(), after)).toEqual([
      { path: 'scale.bass', before: 686, after: 690 },
      { path: 'perpendicularFret', before: 8, after: 7 },
      { path: 'markers.4.kind', before: 'double', after: 'single' },
    ]);
  });

  it('reports a removed array entry or a field present on one side only as one change', () => {
    const after = { ...fan(), markers: fan().markers.slice(0, 9) };
    expect(diffDesigns(fan(), after)).toEqual([{ path: 'markers.9', before: { fret: 24, kind: 'double' }, after: undefined }]);
    expect(diffDesigns({ a: 1 }, { a: 1, b: 2 })).toEqual([{ path: 'b', before: undefined, after: 2 }]);
  });

  it('treats a changed kind of value as one change (object replaced by a number)', () => {
    expect(diffDesigns({ t: { kind: 'equal' } }, { t: 3 })).toEqual([{ path: 't', before: { kind: 'equal' }, after: 3 }]);
  });

  it('shows missing values as a dash and numbers unrounded', () => {
    expect(showValue(undefined)).toBe('—');
    expect(showValue(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(showValue('mm')).toBe('mm');
  });
});

describe('describeChange (the compare table in words and units)', () => {
  it('uses the form labels and shows lengths in the design units, flags and choices in words', () => {
    const before = fan();
    const after = { ...fan(), scale: { ...fan().scale, bass: 690 }, zeroFret: true, scaleAlong: 'centreLine' as const, markers: fan().markers.slice(0, 9) };
    const words = diffDesigns(before, after).map((c) => describeChange(c, before, after));
    expect(words).toContainEqual({ label: 'Bass scale length, last string', before: '686.00 mm', after: '690.00 mm' });
    expect(words).toContainEqual({ label: 'Zero fret', before: 'no', after: 'yes' });
    expect(words).toContainEqual({ label: 'Scale lengths are measured', before: 'along each outer string', after: 'along the centre line (square to the nut)' });
    expect(words).toContainEqual({ label: 'Marker 10', before: 'fret 24, double', after: '—' });
    expect(words.some((w) => w.label.includes('.'))).toBe(false);
  });

  it('shows each side in its own units when the units changed', () => {
    const before = fan();
    const after = { ...fan(), units: 'in' as const, scale: { treble: 648 / 25.4, bass: 686 / 25.4 } };
    const words = diffDesigns(before, after).map((c) => describeChange(c, before, after));
    expect(words).toContainEqual({ label: 'Units', before: 'millimetres', after: 'inches' });
    expect(words).toContainEqual({ label: 'Treble scale length, string 1', before: '648.00 mm', after: '25.512 in' });
  });
});
