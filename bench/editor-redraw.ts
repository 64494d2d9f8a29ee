/**
 * Bench: how long the Layout editor takes to recompute and redraw after a parameter change.
 * Usage: npm run bench, or tsx bench/editor-redraw.ts <base URL of a running built server>
 *
 * In Chromium it types an 8-string, 36-fret fanned design into /layout, then changes the bass
 * scale back and forth. The island (redraw-timing.ts) reads performance.now() around compute
 * (validate + computeLayout + React commit) and the board layer's Konva draw; this script
 * reports medians as JSON lines, plus the ratio to a 6-string 22-fret board measured in the
 * same run.
 */
import type { Page } from 'playwright-core';
import { launchBrowser } from '../tests/support/browser.ts';
import { baseUrl, reportFigure } from './lib/figure.ts';

const origin = process.argv[2] ?? baseUrl();

const WARM_UP_CHANGES = 8;
const MEASURED_CHANGES = 41;

interface Sample {
  computeMs: number;
  drawMs: number;
  totalMs: number;
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? Number.NaN;
};
const round = (value: number) => Math.round(value * 1000) / 1000;

async function measure(page: Page, fields: Record<string, string>, bassScales: [string, string]): Promise<Sample[]> {
  for (const [label, value] of Object.entries(fields)) await page.getByLabel(label, { exact: true }).fill(value);
  const bass = page.getByLabel('Bass scale length, last string (mm)', { exact: true });
  const frets = Number(fields['Frets']);
  await page.waitForFunction(
    (count) => (window as unknown as { Konva: { stages: { find(s: string): unknown[] }[] } }).Konva.stages[0]?.find('.fret-line').length === count,
    frets,
  );
  const samples: Sample[] = [];
  // Each value differs from the one before, so every fill is a change.
  for (let change = 0; change < WARM_UP_CHANGES + MEASURED_CHANGES; change++) {
    const before = await page.evaluate(() => window.__kerflineBench?.samples.length ?? 0);
    await bass.fill(bassScales[change % 2] ?? '');
    await page.waitForFunction((count) => (window.__kerflineBench?.samples.length ?? 0) > count, before);
    const sample = await page.evaluate(() => window.__kerflineBench?.samples.at(-1));
    if (sample && change >= WARM_UP_CHANGES) samples.push(sample);
  }
  return samples;
}

const browser = await launchBrowser();
try {
  const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  await page.addInitScript(() => {
    window.__kerflineBench = { samples: [] };
  });
  await page.goto(new URL('/layout', origin).href, { waitUntil: 'networkidle' });
  await page.getByLabel('Preset').selectOption({ label: 'Blank design' });
  await page.getByRole('button', { name: 'Start', exact: true }).click();

  const small = await measure(page, { Strings: '6', Frets: '22' }, ['651', '650']);
  const large = await measure(
    page,
    {
      Strings: '8',
      Frets: '36',
      'Treble scale length, string 1 (mm)': '648',
      'Perpendicular fret (0 = nut)': '9',
      'String spacing at the nut (mm)': '48',
      'String spacing at the bridge (mm)': '78',
    },
    ['711', '712.5'],
  );
  const largeTotal = median(large.map((s) => s.totalMs));
  const smallTotal = median(small.map((s) => s.totalMs));
  const context = `median of ${MEASURED_CHANGES} changes`;
  reportFigure({
    figure: 'editor redraw after a parameter change, 8 strings 36 frets fanned: median compute + draw',
    value: round(largeTotal),
    unit: 'ms',
    goal: '< 8',
    met: largeTotal < 8,
  });
  reportFigure({
    figure: 'editor redraw, 8 strings 36 frets: median compute (validate, layout, React commit)',
    value: round(median(large.map((s) => s.computeMs))),
    unit: 'ms',
    goal: context,
  });
  reportFigure({
    figure: 'editor redraw, 8 strings 36 frets: median Konva draw of the board layer',
    value: round(median(large.map((s) => s.drawMs))),
    unit: 'ms',
    goal: context,
  });
  reportFigure({
    figure: 'editor redraw: 8x36 fanned board / 6x22 board, medians in the same run',
    value: round(largeTotal / smallTotal),
    unit: 'ratio',
    goal: 'context',
  });
} finally {
  await browser.close();
}
