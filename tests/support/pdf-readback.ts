/**
 * Reads a PDF back with pdfjs-dist (an independent PDF reader) and poppler-utils: page sizes, the
 * straight lines of each page (all of them, and those inside each marked-content tag, BMC) with
 * the current transformation matrix applied, each page's text, page images and QR codes on them.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import jsQR from 'jsqr';
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { PNG } from 'pngjs';

export interface PageSegment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface ReadPage {
  widthPt: number;
  heightPt: number;
  /** Every straight segment drawn on the page, in page points. */
  segments: PageSegment[];
  /** Straight segments drawn inside each marked-content tag, in page points. */
  tagged: Map<string, PageSegment[]>;
  /** The box of each curved path (a circle's box) drawn inside each marked-content tag, in page points. */
  taggedCurves: Map<string, PageBox[]>;
  /** The page's text as pdfjs reads it (items joined; a line break where the item ends a line). */
  text: string;
  /** Straight segments drawn outside any tag, with the pen they were drawn with. */
  untagged: PenSegment[];
}

export interface PenSegment extends PageSegment {
  widthPt: number;
  dashed: boolean;
}

interface GraphicsState {
  matrix: Matrix;
  widthPt: number;
  dashed: boolean;
}

export interface PageBox {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

type Matrix = [number, number, number, number, number, number];
const IDENTITY: Matrix = [1, 0, 0, 1, 0, 0];

function multiply(m: Matrix, n: Matrix): Matrix {
  return [
    m[0] * n[0] + m[2] * n[1],
    m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3],
    m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4],
    m[1] * n[4] + m[3] * n[5] + m[5],
  ];
}

/** pdfjs path codes (DrawOPS): 0 moveTo, 1 lineTo, 2 curveTo, 3 quadraticCurveTo, 4 closePath. */
const PATH_ARGS: Record<number, number> = { 0: 2, 1: 2, 2: 6, 3: 4, 4: 0 };

export async function readPdf(bytes: Uint8Array): Promise<ReadPage[]> {
  const document = await getDocument({ data: new Uint8Array(bytes), verbosity: 0 }).promise;
  const pages: ReadPage[] = [];
  for (let number = 1; number <= document.numPages; number++) {
    const page = await document.getPage(number);
    const [x0, y0, x1, y1] = page.view as [number, number, number, number];
    const operators = await page.getOperatorList();
    const tagged = new Map<string, PageSegment[]>();
    const taggedCurves = new Map<string, PageBox[]>();
    const segments: PageSegment[] = [];
    const untagged: PenSegment[] = [];
    const tags: string[] = [];
    const stack: GraphicsState[] = [];
    // PDF's initial graphics state: line width 1, solid (ISO 32000-1, 8.4.1).
    let state: GraphicsState = { matrix: IDENTITY, widthPt: 1, dashed: false };
    operators.fnArray.forEach((fn, index) => {
      const args = operators.argsArray[index] as unknown[];
      const matrix = state.matrix;
      if (fn === OPS.save) stack.push({ ...state });
      else if (fn === OPS.restore) state = stack.pop() ?? { matrix: IDENTITY, widthPt: 1, dashed: false };
      else if (fn === OPS.transform) state = { ...state, matrix: multiply(matrix, args as Matrix) };
      else if (fn === OPS.setLineWidth) state = { ...state, widthPt: args[0] as number };
      else if (fn === OPS.setDash) state = { ...state, dashed: (args[0] as number[]).length > 0 };
      else if (fn === OPS.beginMarkedContent || fn === OPS.beginMarkedContentProps) {
        const tag = args[0] as { name?: string } | string;
        tags.push(typeof tag === 'string' ? tag : (tag.name ?? ''));
      } else if (fn === OPS.endMarkedContent) tags.pop();
      else if (fn === OPS.constructPath) {
        const path = (args[1] as ArrayLike<number>[])[0]!;
        const drawn = segmentsOf(path, matrix);
        segments.push(...drawn);
        if (tags.length > 0) {
          const tag = tags[tags.length - 1]!;
          const list = tagged.get(tag) ?? [];
          list.push(...drawn);
          tagged.set(tag, list);
          const curve = curveBox(path, matrix);
          if (curve) taggedCurves.set(tag, [...(taggedCurves.get(tag) ?? []), curve]);
        } else {
          const pen = { widthPt: state.widthPt, dashed: state.dashed };
          untagged.push(...drawn.map((segment) => ({ ...segment, ...pen })));
        }
      }
    });
    const text = (await page.getTextContent()).items.map((item) => ('str' in item ? item.str + (item.hasEOL ? '\n' : '') : '')).join('');
    pages.push({ widthPt: x1 - x0, heightPt: y1 - y0, segments, tagged, taggedCurves, untagged, text });
  }
  return pages;
}

function segmentsOf(path: ArrayLike<number>, m: Matrix): PageSegment[] {
  const segments: PageSegment[] = [];
  const apply = (x: number, y: number) => ({ x: m[0] * x + m[2] * y + m[4], y: m[1] * x + m[3] * y + m[5] });
  let current: { x: number; y: number } | null = null;
  for (let i = 0; i < path.length; ) {
    const code = path[i]!;
    if (code === 1 && current) {
      const end = apply(path[i + 1]!, path[i + 2]!);
      segments.push({ x1: current.x, y1: current.y, x2: end.x, y2: end.y });
      current = end;
    } else if (code === 0) {
      current = apply(path[i + 1]!, path[i + 2]!);
    }
    i += 1 + (PATH_ARGS[code] ?? 0);
  }
  return segments;
}

/**
 * The box of every point of a path that has curves (end and control points: for a circle drawn as
 * four quarter Béziers they span exactly its box), or null for a path of straight lines only.
 */
function curveBox(path: ArrayLike<number>, m: Matrix): PageBox | null {
  const box: PageBox = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  let curved = false;
  for (let i = 0; i < path.length; ) {
    const code = path[i]!;
    const count = PATH_ARGS[code] ?? 0;
    if (code === 2 || code === 3) curved = true;
    for (let k = 0; k < count; k += 2) {
      const x = path[i + 1 + k]!;
      const y = path[i + 2 + k]!;
      const px = m[0] * x + m[2] * y + m[4];
      const py = m[1] * x + m[3] * y + m[5];
      box.minX = Math.min(box.minX, px);
      box.minY = Math.min(box.minY, py);
      box.maxX = Math.max(box.maxX, px);
      box.maxY = Math.max(box.maxY, py);
    }
    i += 1 + count;
  }
  return curved ? box : null;
}

function tempPdf(bytes: Uint8Array): string {
  const path = join(mkdtempSync(join(tmpdir(), 'kerfline-pdf-')), 'file.pdf');
  writeFileSync(path, bytes);
  return path;
}

/** Text of one page (1-based) through poppler's pdftotext. */
export function pageText(bytes: Uint8Array, page: number): string {
  return execFileSync('pdftotext', ['-f', String(page), '-l', String(page), '-layout', tempPdf(bytes), '-'], {
    encoding: 'utf8',
  });
}

/** poppler's pdffonts table rows: name, type, encoding, emb, sub, uni. */
export function pdfFonts(bytes: Uint8Array): { name: string; embedded: boolean }[] {
  const out = execFileSync('pdffonts', [tempPdf(bytes)], { encoding: 'utf8' });
  return out
    .split('\n')
    .slice(2)
    .filter((line) => line.trim() !== '')
    .map((line) => {
      const columns = line.trim().split(/\s+/);
      // The emb column is fifth from the end (emb sub uni object-id generation).
      return { name: columns[0] ?? '', embedded: columns[columns.length - 5] === 'yes' };
    });
}

/** Renders one page to PNG with poppler's pdftoppm; returns the PNG path. */
export function renderPage(bytes: Uint8Array, page: number, outputBase: string, dpi = 100): string {
  execFileSync('pdftoppm', ['-f', String(page), '-l', String(page), '-r', String(dpi), '-png', '-singlefile', tempPdf(bytes), outputBase]);
  return `${outputBase}.png`;
}

/** Renders page 1 with pdftoppm and decodes the QR code found in the (optionally cropped) image. */
export function decodeQr(bytes: Uint8Array, dpi: number, crop?: { x: number; y: number; w: number; h: number }): string | null {
  const dir = mkdtempSync(join(tmpdir(), 'kerfline-qr-'));
  try {
    writeFileSync(join(dir, 'in.pdf'), bytes);
    const cropArgs = crop ? ['-x', String(crop.x), '-y', String(crop.y), '-W', String(crop.w), '-H', String(crop.h)] : [];
    execFileSync('pdftoppm', ['-r', String(dpi), '-f', '1', '-l', '1', '-singlefile', '-png', ...cropArgs, join(dir, 'in.pdf'), join(dir, 'out')]);
    const png = PNG.sync.read(readFileSync(join(dir, 'out.png')));
    return jsQR(new Uint8ClampedArray(png.data), png.width, png.height)?.data ?? null;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
