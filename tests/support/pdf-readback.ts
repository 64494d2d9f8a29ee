/**
 * Reads a PDF back with pdfjs-dist (an independent PDF reader) and poppler-utils: page sizes, the
 * straight lines inside each marked-content tag (BMC), and each page's text.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';

export interface PageSegment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface ReadPage {
  widthPt: number;
  heightPt: number;
  /** Straight segments drawn inside each marked-content tag, in page points. */
  tagged: Map<string, PageSegment[]>;
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
      else if (fn === OPS.constructPath && tags.length > 0) {
        const list = tagged.get(tags[tags.length - 1]!) ?? [];
        list.push(...segmentsOf((args[1] as ArrayLike<number>[])[0]!, matrix));
        tagged.set(tags[tags.length - 1]!, list);
      } else if (fn === OPS.constructPath) {
        const pen = { widthPt: state.widthPt, dashed: state.dashed };
        untagged.push(...segmentsOf((args[1] as ArrayLike<number>[])[0]!, matrix).map((segment) => ({ ...segment, ...pen })));
      }
    });
    pages.push({ widthPt: x1 - x0, heightPt: y1 - y0, tagged, untagged });
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
