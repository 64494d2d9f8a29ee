/**
 * Accessible by test: the axe sweep (axe-core through @axe-core/playwright) on every page as each
 * visitor sees it (signed out, owner, builder, client, the proof page, the editor with each of its
 * panels open), zero serious or critical violations; the footer's contrast (WCAG 2.2 SC 1.4.3,
 * 4.5:1 for normal text); names that contain their visible labels (SC 2.5.3); tabs that follow
 * the WAI-ARIA Authoring Practices tabs pattern; and the drawing's keyboard fret readout.
 * The counts by impact are written to test-results/axe-summary.json.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '~/lib/auth/index.server.ts';
import { axeSummary, type AxeSummary } from '../support/axe.ts';
import { ARTIFACTS_DIR, BASE_URL, launchBrowser } from '../support/browser.ts';
import { ensureDesign } from '../support/designs.ts';
import { readScene, waitForDrawing } from '../support/konva-scene.ts';
import { signInAs, type TestUser } from '../support/sessions.ts';
import { shopRows, type ShopRows } from '../support/shop-rows.ts';
import { closeDb } from '../support/test-db.ts';

let browser: Browser;
let owner: TestUser;
let builder: TestUser;
let client: TestUser;
let rows: ShopRows;
const summaries: Record<string, AxeSummary['byImpact']> = {};

beforeAll(async () => {
  browser = await launchBrowser();
  owner = await signInAs('owner@wrenfield.example');
  builder = await signInAs('builder@wrenfield.example');
  client = await signInAs('client@wrenfield.example');
  const boardId = await ensureDesign(builder.shopId, builder.id, 'Seven-string', 'seven-string-fan');
  rows = await shopRows(builder.shopId, builder.id, client.email, 'Axe sweep board', boardId);
});
afterAll(async () => {
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  writeFileSync(join(ARTIFACTS_DIR, 'axe-summary.json'), `${JSON.stringify(summaries, null, 2)}\n`);
  await browser?.close();
  await closeDb();
});

async function contextAs(user: TestUser | null, viewport = { width: 1280, height: 900 }): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport });
  if (user) await context.addCookies([{ name: SESSION_COOKIE, value: user.token, url: BASE_URL }]);
  return context;
}

/** Opens `path`, waits for its islands, and expects no serious or critical axe violation. */
async function sweep(page: Page, label: string, path: string | null, ready?: (page: Page) => Promise<unknown>): Promise<void> {
  if (path !== null) await page.goto(`${BASE_URL}${path}`, { waitUntil: 'networkidle' });
  if (ready) await ready(page);
  const summary = await axeSummary(page);
  summaries[label] = summary.byImpact;
  expect(summary.blocking.join('\n'), `${label} (${path ?? page.url()})`).toBe('');
}

type Who = 'signed out' | 'owner' | 'builder' | 'client';
interface SweptPage {
  label: string;
  path: () => string;
  ready?: (page: Page) => Promise<unknown>;
  /** Opened at this size (default 1280×900). */
  viewport?: { width: number; height: number };
  /** A panel of the editor to open (by its tab) before the sweep, and what it shows once loaded. */
  tab?: { name: string; shows: 'table' | 'button' | 'listitem' };
}

const boardsReady = (page: Page) => page.getByRole('table').first().waitFor();
const EDITOR_TABS = [
  { name: 'Fret table', shows: 'table' },
  { name: 'Exports', shows: 'button' },
  { name: 'History', shows: 'listitem' },
  { name: 'Proofs', shows: 'button' },
] as const;

const PAGES: Record<Who, SweptPage[]> = {
  'signed out': [
    { label: 'home', path: () => '/' },
    { label: 'sign in', path: () => '/sign-in' },
    { label: 'forgot password', path: () => '/forgot-password' },
    { label: 'create shop', path: () => '/create-shop' },
    { label: 'layout (editor)', path: () => '/layout?preset=seven-string-fan', ready: waitForDrawing },
    { label: 'layout view mode', path: () => '/layout?preset=seven-string-fan&mode=view', ready: waitForDrawing },
    { label: 'safety', path: () => '/safety' },
    { label: 'measuring', path: () => '/measuring' },
    { label: 'invitation link no longer valid', path: () => '/invitations/AAAAAAAAAAAAAAAAAAAAAA' },
    { label: '404', path: () => '/no-such-page' },
    { label: 'proof page (link)', path: () => `/p/${rows.proofToken}`, ready: waitForDrawing },
    { label: 'proof page (link) at 390×844', path: () => `/p/${rows.proofToken}`, ready: waitForDrawing, viewport: { width: 390, height: 844 } },
  ],
  owner: [
    { label: 'boards', path: () => '/boards', ready: boardsReady },
    { label: 'template shelf', path: () => '/templates' },
    { label: 'a template', path: () => `/templates/${rows.templateId}` },
    { label: 'members', path: () => '/members' },
    { label: 'account', path: () => '/account' },
    { label: 'editor', path: () => `/layout?board=${rows.boardId}`, ready: waitForDrawing },
  ],
  builder: [
    { label: 'boards', path: () => '/boards', ready: boardsReady },
    { label: 'template shelf', path: () => '/templates' },
    { label: 'account', path: () => '/account' },
    { label: 'proofs of a board', path: () => `/boards/${rows.boardId}/proofs` },
    { label: 'template check', path: () => `/boards/${rows.boardId}/check` },
    { label: 'editor', path: () => `/layout?board=${rows.boardId}`, ready: waitForDrawing },
    ...EDITOR_TABS.map((tab) => ({ label: `editor (${tab.name})`, path: () => `/layout?board=${rows.boardId}`, ready: waitForDrawing, tab })),
  ],
  client: [
    { label: 'shared with me', path: () => '/shared' },
    { label: 'a shared proof', path: () => `/shared/${rows.proofId}`, ready: waitForDrawing },
    { label: 'account', path: () => '/account' },
  ],
};

const userFor = (who: Who): TestUser | null => ({ 'signed out': null, owner, builder, client })[who];

describe('the axe sweep: zero serious or critical violations on every page', () => {
  for (const [who, pages] of Object.entries(PAGES) as [Who, SweptPage[]][]) {
    describe(who, () => {
      for (const swept of pages) {
        it(swept.label, async () => {
          const context = await contextAs(userFor(who), swept.viewport);
          const page = await context.newPage();
          const tab = swept.tab;
          await sweep(page, `${who}: ${swept.label}`, swept.path(), async (p) => {
            await swept.ready?.(p);
            if (!tab) return;
            await p.getByRole('tab', { name: tab.name }).click();
            await p.getByRole('tabpanel', { name: tab.name }).getByRole(tab.shows).first().waitFor();
          });
          await context.close();
        });
      }
    });
  }
});

/** WCAG 2.2 contrast ratio (its definitions of relative luminance and contrast ratio) of two CSS rgb() colours. */
function contrastRatio(foreground: string, background: string): number {
  const luminance = (css: string) => {
    const [r, g, b] = (css.match(/[\d.]+/g) ?? []).slice(0, 3).map((v) => {
      const c = Number(v) / 255;
      return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
    });
    return 0.2126 * (r ?? 0) + 0.7152 * (g ?? 0) + 0.0722 * (b ?? 0);
  };
  const [light, dark] = [luminance(foreground), luminance(background)].sort((a, b) => b - a);
  return (light! + 0.05) / (dark! + 0.05);
}

describe('contrast and names', () => {
  it('the footer text reaches 4.5:1 against the page (WCAG 2.2 SC 1.4.3, normal text)', async () => {
    const page = await (await contextAs(null)).newPage();
    await page.goto(`${BASE_URL}/`);
    const colours = await page.getByRole('contentinfo').evaluate((footer) => {
      // The nearest background that is painted shows through the footer (the page's, by default white).
      let background = 'rgb(255, 255, 255)';
      for (let element: Element | null = footer; element; element = element.parentElement) {
        const colour = getComputedStyle(element).backgroundColor;
        if (colour !== 'rgba(0, 0, 0, 0)' && colour !== 'transparent') {
          background = colour;
          break;
        }
      }
      return { text: getComputedStyle(footer).color, page: background };
    });
    // Worked check of the formula: black on white is 21:1 (WCAG 2.2, contrast ratio definition).
    expect(contrastRatio('rgb(0, 0, 0)', 'rgb(255, 255, 255)')).toBeCloseTo(21, 6);
    expect(contrastRatio(colours.text, colours.page)).toBeGreaterThanOrEqual(4.5);
    await page.context().close();
  });

  it('every board\'s "Export JSON" link has a name that contains its visible label (WCAG 2.2 SC 2.5.3)', async () => {
    const page = await (await contextAs(builder)).newPage();
    await page.goto(`${BASE_URL}/boards`, { waitUntil: 'networkidle' });
    const links = page.getByRole('link', { name: /JSON/ });
    const count = await links.count();
    expect(count).toBeGreaterThan(0);
    for (let i = 0; i < count; i++) {
      const link = links.nth(i);
      const visible = (await link.innerText()).trim();
      expect(visible).toBe('Export JSON');
      expect(await link.getAttribute('aria-label')).toMatch(/^Export JSON of /);
    }
    // Found by its visible words, as a speech user would say them.
    expect(await page.getByRole('link', { name: 'Export JSON' }).count()).toBe(count);
    await page.context().close();
  });
});

describe('keyboard', () => {
  it('the editor\'s panel tabs follow the WAI-ARIA tabs pattern: roving tabindex, Left/Right/Home/End, aria-selected, aria-controls', async () => {
    const page = await (await contextAs(builder)).newPage();
    await page.goto(`${BASE_URL}/layout?board=${rows.boardId}`, { waitUntil: 'networkidle' });
    await waitForDrawing(page);
    const list = page.getByRole('tablist', { name: 'Panels' });
    const tabs = list.getByRole('tab');
    const names = await tabs.allInnerTexts();
    expect(names).toEqual(['Design', 'Fret table', 'Exports', 'History', 'Proofs']);

    /** The selected tab's name, checking the pattern's attributes on every tab as it goes. */
    const selected = async () => {
      const state = await tabs.evaluateAll((elements) =>
        elements.map((tab) => ({
          name: tab.textContent,
          selected: tab.getAttribute('aria-selected'),
          tabIndex: tab.getAttribute('tabindex'),
          controls: tab.getAttribute('aria-controls'),
          panelThere: document.getElementById(tab.getAttribute('aria-controls') ?? '') !== null,
          panelShown: !(document.getElementById(tab.getAttribute('aria-controls') ?? '')?.hidden ?? true),
          focused: document.activeElement === tab,
        })),
      );
      const on = state.filter((tab) => tab.selected === 'true');
      expect(on).toHaveLength(1);
      for (const tab of state) {
        expect(tab.panelThere, `${tab.name}: aria-controls names a panel`).toBe(true);
        expect(tab.tabIndex, `${tab.name}: roving tabindex`).toBe(tab.selected === 'true' ? '0' : '-1');
        expect(tab.panelShown, `${tab.name}: only the selected tab's panel shows`).toBe(tab.selected === 'true');
      }
      expect(on[0]!.focused, 'focus follows the selection').toBe(true);
      return on[0]!.name;
    };

    await list.getByRole('tab', { name: 'Design' }).focus();
    await page.keyboard.press('ArrowRight');
    expect(await selected()).toBe('Fret table');
    await page.getByRole('tabpanel', { name: 'Fret table' }).getByRole('table', { name: 'Fret table' }).waitFor();
    await page.keyboard.press('End');
    expect(await selected()).toBe('Proofs');
    await page.keyboard.press('ArrowRight');
    expect(await selected()).toBe('Design');
    await page.keyboard.press('ArrowLeft');
    expect(await selected()).toBe('Proofs');
    await page.keyboard.press('Home');
    expect(await selected()).toBe('Design');
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    expect(await selected()).toBe('Exports');
    // Tab leaves the tab list for the panel: one stop for the whole list.
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('role'))).toBe('tabpanel');
    await page.context().close();
  });

  it('the drawing takes focus; arrow keys move between frets and strings and the readout is announced in the design\'s units', async () => {
    const page = await (await contextAs(null)).newPage();
    await page.goto(`${BASE_URL}/layout?preset=seven-string-fan&mode=view`, { waitUntil: 'networkidle' });
    await waitForDrawing(page);
    const drawing = page.getByRole('application', { name: /Drawing of the board/ });
    // Reached with the Tab key, as a keyboard user would.
    for (let i = 0; i < 30 && !(await drawing.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press('Tab');
    expect(await drawing.evaluate((el) => el === document.activeElement)).toBe(true);

    const readout = page.getByRole('status', { name: 'Keyboard readout' });
    expect(await readout.getAttribute('aria-live')).toBe('polite');
    await page.keyboard.press('ArrowRight');
    // 12-tone equal temperament: fret 1 sits at 1 - 2^(-1/12) of the 648 mm treble string.
    const fret1 = (648 * (1 - 2 ** (-1 / 12))).toFixed(2);
    expect(await readout.innerText()).toBe(`Fret 1, string 1: ${fret1} mm from the nut, ${fret1} mm from the nut`);
    for (let i = 0; i < 11; i++) await page.keyboard.press('ArrowRight');
    // Fret 12 halves each string (an octave is a 2:1 ratio): 324 mm on the 648 mm string.
    expect(await readout.innerText()).toMatch(/^Fret 12, string 1: 324\.00 mm from the nut, \d+\.\d\d mm from fret 11$/);
    for (let i = 0; i < 6; i++) await page.keyboard.press('ArrowUp');
    expect(await readout.innerText()).toMatch(/^Fret 12, string 7: 343\.00 mm from the nut, /);
    await page.keyboard.press('ArrowUp');
    expect(await readout.innerText(), 'stops at the bass string').toMatch(/^Fret 12, string 7: /);
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowLeft');
    // String 6's own scale length, as the drawing's string line carries it; 12-TET fret 11 at 1 - 2^(-11/12) of it.
    const scale6 = await page.evaluate(() => {
      type Node = { getAttr(name: string): unknown };
      const stage = (window as unknown as { Konva: { stages: { find(s: string): Node[] }[] } }).Konva.stages[0];
      return Number(stage?.find('.string-line').find((n) => n.getAttr('string') === 6)?.getAttr('scaleLength'));
    });
    expect(scale6).toBeGreaterThan(648);
    expect(scale6).toBeLessThan(686);
    const fret11 = (scale6 * (1 - 2 ** (-11 / 12))).toFixed(2);
    expect(await readout.innerText()).toMatch(new RegExp(`^Fret 11, string 6: ${fret11.replace('.', '\\.')} mm from the nut, `));
    // The readout table and the drawing's highlight follow the keyboard too.
    await page.getByRole('region', { name: 'Fret 11 readout' }).waitFor();
    const marker = await page.evaluate(() => {
      type Node = { getAttr(name: string): unknown };
      const stage = (window as unknown as { Konva: { stages: { find(s: string): Node[] }[] } }).Konva.stages[0];
      const node = stage?.find('.fret-cursor')[0];
      return node ? { fret: node.getAttr('fret'), string: node.getAttr('string') } : null;
    });
    expect(marker).toEqual({ fret: 11, string: 6 });
    expect((await readScene(page)).frets.length).toBe(24);
    await page.context().close();
  });
});
