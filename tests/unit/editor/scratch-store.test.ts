import { describe, expect, it } from 'vitest';
import { SCRATCH_STORAGE_KEY, scratchStore } from '~/components/editor/design-store.ts';
import { loadScreenPxPerMm, measurementProblem, pxPerMmFromMeasurement, saveScreenPxPerMm } from '~/components/editor/screen-calibration.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';

function memoryStorage() {
  const items = new Map<string, string>();
  return {
    getItem: (key: string) => items.get(key) ?? null,
    setItem: (key: string, value: string) => void items.set(key, value),
  };
}

describe('scratch design store', () => {
  it('keeps a design and loads it back', async () => {
    const storage = memoryStorage();
    const store = scratchStore(storage);
    expect(await store.load()).toBeNull();
    const design = DEMO_DESIGNS[1]?.design;
    if (!design) throw new Error('no demo');
    expect((await store.save(design)).state).toBe('saved');
    expect(await store.load()).toEqual(design);
  });

  it('ignores a kept value that is not a valid design', async () => {
    const storage = memoryStorage();
    storage.setItem(SCRATCH_STORAGE_KEY, '{"name":"broken"');
    expect(await scratchStore(storage).load()).toBeNull();
    storage.setItem(SCRATCH_STORAGE_KEY, JSON.stringify({ name: 'x', units: 'furlongs' }));
    expect(await scratchStore(storage).load()).toBeNull();
  });
});

describe('screen calibration', () => {
  it('derives px per mm from the measured 100 mm bar', () => {
    // The bar is 100 mm at 96 px per inch; seen as 80 mm, the screen shows 100/80 times more px per mm.
    expect(pxPerMmFromMeasurement(100)).toBe((100 * 96) / 25.4 / 100);
    expect(Math.abs(pxPerMmFromMeasurement(80) - (96 / 25.4) * 1.25)).toBeLessThan(1e-12);
    expect(measurementProblem(80)).toBeNull();
    expect(measurementProblem(5)).toMatch(/from 20 to 500 mm/);
    expect(measurementProblem(Number.NaN)).toMatch(/number/);
  });

  it('stores the calibration and falls back to 96 px per inch', () => {
    const storage = memoryStorage();
    expect(loadScreenPxPerMm(storage)).toEqual({ pxPerMm: 96 / 25.4, calibrated: false });
    saveScreenPxPerMm(storage, 4.2);
    expect(loadScreenPxPerMm(storage)).toEqual({ pxPerMm: 4.2, calibrated: true });
  });
});
