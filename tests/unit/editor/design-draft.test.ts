import { describe, expect, it } from 'vitest';
import { applySpacingOffer, draftFromDesign, parseLength, spacingOffer, switchUnits, typedLength, validateDraft, type DesignDraft } from '~/components/editor/design-draft.ts';
import { blankDesign } from '~/lib/presets/blank-design.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { Design } from '~/lib/schemas/design.ts';

function demo(id: string): Design {
  const found = DEMO_DESIGNS.find((d) => d.id === id);
  if (!found) throw new Error(`no demo ${id}`);
  return found.design;
}

function validDesign(draft: DesignDraft): Design {
  const result = validateDraft(draft);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.design;
}

describe('form draft and the shared design schema', () => {
  it('a draft made from a design validates back to the same design', () => {
    for (const { design } of DEMO_DESIGNS) expect(validDesign(draftFromDesign(design))).toEqual(design);
    expect(validDesign(draftFromDesign(blankDesign()))).toEqual(blankDesign());
  });

  it('reports text that is not a number on its own field, and schema errors with the schema path', () => {
    const draft = draftFromDesign(blankDesign());
    const typed = { ...draft, lengths: { ...draft.lengths, 'scale.bass': typedLength('six hundred') } };
    const result = validateDraft({ ...typed, numbers: { ...typed.numbers, frets: '40' } });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.issues).toContainEqual({ path: 'scale.bass', message: 'enter a number' });
    expect(result.issues.find((issue) => issue.path === 'frets')?.message).toMatch(/whole number from 1 to 36/);
  });

  it('builds markers from the single and double lists', () => {
    const draft = { ...draftFromDesign(blankDesign()), singleMarkers: '5, 3 7', doubleMarkers: '12' };
    expect(validDesign(draft).markers).toEqual([
      { fret: 3, kind: 'single' },
      { fret: 5, kind: 'single' },
      { fret: 7, kind: 'single' },
      { fret: 12, kind: 'double' },
    ]);
    const bad = validateDraft({ ...draft, singleMarkers: '3 x' });
    expect(bad.ok ? [] : bad.issues).toContainEqual({ path: 'markers', message: '"x" is not a fret number' });
  });
});

describe('unit switching', () => {
  it('converts every length exactly at 25.4 mm per inch (international inch, 1959)', () => {
    const mm = demo('seven-string-fan');
    const inches = validDesign(switchUnits(draftFromDesign(mm), 'in'));
    expect(inches.units).toBe('in');
    expect(inches.scale.treble).toBe(648 / 25.4);
    expect(inches.scale.bass).toBe(686 / 25.4);
    expect(inches.stringSpacing.bridge).toBe(63 / 25.4);
    expect(inches.compensation.saddleBass).toBe(4 / 25.4);
    // Counts are not lengths and stay as they are.
    expect(inches.frets).toBe(mm.frets);
    expect(inches.perpendicularFret).toBe(mm.perpendicularFret);
  });

  it('round-trips mm -> in -> mm and in -> mm -> in to the same numbers, bit for bit', () => {
    for (const { design } of DEMO_DESIGNS) {
      const other = design.units === 'mm' ? 'in' : 'mm';
      const draft = draftFromDesign(design);
      const there = switchUnits(draft, other);
      const back = switchUnits(there, design.units);
      expect(back).toEqual(draft);
      expect(validDesign(back)).toEqual(design);
    }
  });

  it('shows converted values rounded but computes with the exact value; an edited field converts from what was typed', () => {
    const draft = switchUnits(draftFromDesign(demo('seven-string-fan')), 'in');
    // Shown to 0.0001 in, the way a rule is read.
    expect(draft.lengths['scale.treble'].text).toBe('25.5118');
    const edited = { ...draft, lengths: { ...draft.lengths, 'scale.treble': typedLength('25.5') } };
    const back = switchUnits(edited, 'mm');
    expect(back.lengths['scale.treble'].text).toBe('647.7');
    expect(back.lengths['scale.bass'].text).toBe('686');
    expect(validDesign(back).scale.treble).toBe(25.5 * 25.4);
  });
});

describe('lengths read like a rule', () => {
  it('a loaded inch design shows 0.0001 in (0.6 mm slot: 0.0236 in) and keeps the exact value until edited', () => {
    const inches = validDesign(switchUnits(draftFromDesign(blankDesign()), 'in'));
    const draft = draftFromDesign(inches);
    expect(draft.lengths['slot.width'].text).toBe('0.0236');
    expect(validDesign(draft).slot.width).toBe(0.6 / 25.4);
    expect(validDesign(draft)).toEqual(inches);
  });

  it('a loaded millimetre design shows 0.01 mm and keeps the exact value', () => {
    const design = validDesign({ ...draftFromDesign(blankDesign()), lengths: { ...draftFromDesign(blankDesign()).lengths, 'slot.width': typedLength('0.5588') } });
    const draft = draftFromDesign(design);
    expect(draft.lengths['slot.width'].text).toBe('0.56');
    expect(validDesign(draft).slot.width).toBe(0.5588);
  });

  it.each([
    ['1 3/4', 1.75],
    ['3/4', 0.75],
    ['25 1/2"', 25.5],
    ['25.5"', 25.5],
    ['25.5 in', 25.5],
    ['13 7/8 in', 13.875],
  ])('an inch field takes %j as %d in', (text, inches) => {
    expect(parseLength(text, 'in')).toBe(inches);
  });

  it.each(['1 3/0', '1/2/3', '25,5', 'three', '1 3/4 mm'])('an inch field refuses %j', (text) => {
    expect(parseLength(text, 'in')).toBeNull();
  });

  it('a millimetre field takes decimals (and a trailing "mm"), not fractions', () => {
    expect(parseLength('648', 'mm')).toBe(648);
    expect(parseLength('648 mm', 'mm')).toBe(648);
    expect(parseLength('1 3/4', 'mm')).toBeNull();
  });
});

describe('string count and spacing', () => {
  it('offers to keep the spacing per string: a 6-string at 43 / 58 mm made a 7-string becomes 51.6 / 69.6 mm (hand-computed: 43/5·6, 58/5·6)', () => {
    const base = draftFromDesign(blankDesign());
    const six = { ...base, lengths: { ...base.lengths, 'stringSpacing.nut': typedLength('43'), 'stringSpacing.bridge': typedLength('58') } };
    const seven = { ...six, numbers: { ...six.numbers, strings: '7' } };
    const offer = spacingOffer(seven, 6);
    expect(offer).toMatchObject({ from: 6, to: 7 });
    expect(Math.abs(offer!.perStringNut - 8.6)).toBeLessThan(1e-12); // mm
    expect(Math.abs(offer!.nut - 51.6)).toBeLessThan(1e-12); // mm
    expect(Math.abs(offer!.bridge - 69.6)).toBeLessThan(1e-12); // mm
    const applied = validDesign(applySpacingOffer(seven, offer!));
    expect(applied.strings).toBe(7);
    expect(Math.abs(applied.stringSpacing.nut - 51.6)).toBeLessThan(1e-12);
  });

  it('offers nothing when the count did not change or is not a whole number of at least 2', () => {
    const draft = draftFromDesign(blankDesign());
    expect(spacingOffer(draft, 6)).toBeNull();
    expect(spacingOffer({ ...draft, numbers: { ...draft.numbers, strings: '1' } }, 6)).toBeNull();
    expect(spacingOffer({ ...draft, numbers: { ...draft.numbers, strings: 'seven' } }, 6)).toBeNull();
  });
});
