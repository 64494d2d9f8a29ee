/** Reads PDFs back for tests: page sizes, text and straight path segments (pdfjs-dist), and page images (poppler's pdftoppm). */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { PNG } from 'pngjs';
import jsQR from 'jsqr';

export interface Segment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export async function readPdf(bytes: Uint8Array) {
  const pdf = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false }).promise;
  const pages = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const page = await pdf.getPage(n);
    const [, , width, height] = page.view as [number, number, number, number];
    const text = (await page.getTextContent()).items.map((item) => ('str' in item ? item.str + (item.hasEOL ? '\n' : '') : '')).join('');
    const ops = await page.getOperatorList();
    const segments: Segment[] = [];
    ops.fnArray.forEach((fn, i) => {
      if (fn !== OPS.constructPath) return;
      const data = (ops.argsArray[i] as [number, [Record<number, number>]])[1][0];
      const values = Object.values(data);
      let x = 0;
      let y = 0;
      for (let k = 0; k < values.length; ) {
        const op = values[k]!;
        if (op === 0 || op === 1) {
          const nx = values[k + 1]!;
          const ny = values[k + 2]!;
          if (op === 1) segments.push({ x1: x, y1: y, x2: nx, y2: ny });
          x = nx;
          y = ny;
          k += 3;
        } else {
          // pdfjs path codes: 2 = cubic curve (6 numbers), 3 = quadratic (4), 4 = close.
          k += op === 2 ? 7 : op === 3 ? 5 : 1;
        }
      }
    });
    pages.push({ width, height, text, segments });
  }
  return pages;
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
