import { describe, expect, it } from 'vitest';
import { diffDesigns, showValue } from '~/components/boards/design-diff.ts';
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
