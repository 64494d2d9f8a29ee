/**
 * The Layout editor's drawing as a test reads it: the named Konva nodes (window.Konva.stages),
 * whose line points are in board coordinates, and the page position of a board point.
 */
import type { Page } from 'playwright-core';

export interface Scene {
  frets: { fret: number; points: number[] }[];
  strings: { string: number; points: number[] }[];
  centre: number[];
  zoom: number;
}

/** Reads the drawing's named Konva nodes (board coordinates are kept in each line's points). */
export function readScene(page: Page): Promise<Scene> {
  return page.evaluate(() => {
    type Node = { getAttr(name: string): unknown; points(): number[] };
    const konva = (window as unknown as { Konva: { stages: { find(selector: string): Node[] }[] } }).Konva;
    const stage = konva.stages[0];
    if (!stage) throw new Error('no Konva stage');
    const view = stage.find('.board-view')[0];
    return {
      frets: stage.find('.fret-line').map((n) => ({ fret: Number(n.getAttr('fret')), points: n.points() })),
      strings: stage.find('.string-line').map((n) => ({ string: Number(n.getAttr('string')), points: n.points() })),
      centre: stage.find('.centre-line')[0]?.points() ?? [],
      zoom: Number(view?.getAttr('scaleX')),
    };
  });
}

/** Page coordinates of a board point, through the drawing's own transform. */
export function pagePointOf(page: Page, x: number, y: number): Promise<{ x: number; y: number }> {
  return page.evaluate(
    ([bx, by]) => {
      type View = { getAbsoluteTransform(): { point(p: { x: number; y: number }): { x: number; y: number } } };
      const stage = (window as unknown as { Konva: { stages: { find(s: string): View[]; container(): HTMLElement }[] } }).Konva.stages[0];
      const view = stage?.find('.board-view')[0];
      if (!stage || !view) throw new Error('no drawing');
      const onStage = view.getAbsoluteTransform().point({ x: bx, y: by });
      const box = stage.container().getBoundingClientRect();
      return { x: box.left + onStage.x, y: box.top + onStage.y };
    },
    [x, y] as const,
  );
}

/** Scrolls the drawing into view, then moves the mouse to the middle of fret `fret`'s line, as a person pointing at it would. */
export async function hoverFret(page: Page, fret: number): Promise<void> {
  await page.evaluate(() => {
    const stage = (window as unknown as { Konva: { stages: { container(): HTMLElement }[] } }).Konva.stages[0];
    stage?.container().scrollIntoView({ block: 'center' });
  });
  const line = (await readScene(page)).frets.find((f) => f.fret === fret)?.points ?? [];
  if (line.length < 4) throw new Error(`no fret ${fret} in the drawing`);
  const at = await pagePointOf(page, ((line[0] ?? 0) + (line[2] ?? 0)) / 2, ((line[1] ?? 0) + (line[3] ?? 0)) / 2);
  await page.mouse.move(at.x, at.y);
}

/** Waits until the editor's Konva stage has drawn the board's fret lines. */
export async function waitForDrawing(page: Page): Promise<void> {
  await page.waitForFunction(() => {
    const konva = (window as unknown as { Konva?: { stages: { find(selector: string): unknown[] }[] } }).Konva;
    return (konva?.stages[0]?.find('.fret-line').length ?? 0) > 0;
  }, undefined, { timeout: 10_000 });
}
