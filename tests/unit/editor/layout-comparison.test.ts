import { describe, expect, it } from 'vitest';
import { compareLayouts } from '~/components/editor/layout-comparison';
import { computeLayout } from '~/lib/geometry/layout';
import { DEMO_DESIGNS } from '~/lib/presets/demo-designs';

const design = DEMO_DESIGNS[0]?.design;
if (!design) throw new Error('no demo');
const preview = JSON.parse(JSON.stringify(computeLayout(design)));

describe('preview versus server layout', () => {
  it('finds two layouts of the same design the same', () => {
    expect(compareLayouts(preview, JSON.parse(JSON.stringify(computeLayout(design))))).toEqual({ kind: 'same' });
  });

  it('reports the first number that differs by more than 1e-9 design units, with its path', () => {
    const server = structuredClone(preview);
    server.frets[11].points[2].fromNut += 0.01;
    const result = compareLayouts(preview, server);
    expect(result).toMatchObject({ kind: 'numbers-differ', path: 'layout.frets.11.points.2.fromNut' });
    const tiny = structuredClone(preview);
    tiny.frets[11].points[2].fromNut += 1e-12;
    expect(compareLayouts(preview, tiny)).toEqual({ kind: 'same' });
  });

  it('reports a different shape (missing fret, extra field)', () => {
    const fewer = structuredClone(preview);
    fewer.frets.pop();
    expect(compareLayouts(preview, fewer)).toEqual({ kind: 'shape-differs', path: 'layout.frets.length' });
    expect(compareLayouts(preview, { ...preview, extra: 1 }).kind).toBe('shape-differs');
  });
});
