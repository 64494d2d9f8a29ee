/**
 * The one G-code writer: a toolpath plan (gcode-plan.ts) in, RS-274 text out, as LinuxCNC and
 * GRBL read it. Straight moves only (G0/G1), absolute (G90), XY plane (G17), G21 for a mm design
 * and G20 for inches. Everything meant for a person (board, fingerprint, units, origin, Z zero,
 * tool, feeds, cautions) is in parenthesised comments, never in a word a controller acts on.
 *
 * Where the dialects differ: LinuxCNC gets a path-blending tolerance (G64 P, which GRBL does not
 * know) and a tool change (T1 M6, which GRBL does not take); comments are kept short for GRBL's
 * 80-character line buffer (from memory), and both end with M2.
 */
import type { LengthUnit } from '~/lib/format/units.ts';
import { runTime, type ToolMove, type ToolpathPlan } from './gcode-plan.ts';
import { DRY_RUN_NOTE, machineCaution } from './safety-note.ts';

/** Decimals written: 0.0001 mm and 0.000001 in, both well under 0.001 mm. */
const DECIMALS: Readonly<Record<LengthUnit, number>> = { mm: 4, in: 6 };
/** Longest comment text per line (GRBL reads at most 80 characters a line; from memory). */
const COMMENT_WIDTH = 70;

export interface GcodeHeader {
  boardName: string;
  /** Revision number, null when unsaved. */
  revision: number | null;
  fingerprint: string;
  /** Set while the board differs from what the client approved (approvalWarning in lib/proofs). */
  approvalWarning?: string | null;
}

export function gcodeText(plan: ToolpathPlan, header: GcodeHeader): string {
  const s = plan.settings;
  const n = (value: number) => number(value, s.units);
  const unitWord = s.units === 'mm' ? 'G21' : 'G20';
  const minutes = runTime(plan).total;
  const lines: string[] = [
    ...comments([
      `Kerfline slot toolpath: ${header.boardName}`,
      `Revision ${header.revision ?? 'unsaved'}, fingerprint ${header.fingerprint}`,
      ...(header.approvalWarning ? [`NOT THE APPROVED LAYOUT: ${header.approvalWarning}`] : []),
      `Units ${s.units} (${unitWord}); dialect ${s.dialect}`,
      `Origin ${s.origin === 'nut-centre' ? 'nut centre' : 'board lower-left corner'}: +X toward the bridge, +Y toward the bass side (as the DXF)`,
      `Z zero ${s.zZero === 'crown' ? 'on the crown (board top on the centre line)' : 'on the board top at the nut, treble edge'}; Z up`,
      `Tool diameter ${n(s.toolDiameter)}, slot width ${n(s.slotWidth)}, depth ${n(s.depth)} below the top, passes of at most ${n(s.passDepth)}`,
      `Feed ${n(s.feed)}, plunge ${n(s.plungeFeed)} ${s.units}/min; spindle ${s.spindle} rpm; safe Z ${n(s.safeZ)}`,
      `Chord tolerance ${n(s.chordTolerance)}; estimated run time ${minutes.toFixed(1)} min (rapids at ${n(s.rapidRate)} ${s.units}/min, no acceleration)`,
      ...(s.dryRun > 0 ? [`DRY RUN: every Z raised by ${n(s.dryRun)}; the cutter never reaches the wood`] : []),
      machineCaution(s.units, 'slot toolpath'),
      `CAUTION: ${DRY_RUN_NOTE}`,
    ]),
    `${unitWord} G90 G17 G94`,
    ...(s.dialect === 'linuxcnc' ? [`G64 P${n(s.chordTolerance)}`, 'T1 M6'] : []),
    `G0 Z${n(plan.start.z)}`,
    `G0 X${n(plan.start.x)} Y${n(plan.start.y)}`,
    `M3 S${Math.round(s.spindle)}`,
    'G4 P2',
  ];
  let fret: number | null = null;
  // F is modal: written only when the feed changes (a plunge after cuts, cuts after a plunge).
  let feed: number | null = null;
  for (const move of plan.moves) {
    if (move.fret !== fret) {
      fret = move.fret;
      lines.push(`(fret ${fret === 0 ? '0, zero fret' : fret})`);
    }
    const rate = move.kind === 'cut' ? s.feed : move.kind === 'plunge' ? s.plungeFeed : null;
    const line = moveLine(move, n);
    if (rate === null || rate === feed) lines.push(line);
    else {
      lines.push(`${line} F${n(rate)}`);
      feed = rate;
    }
  }
  lines.push(`G0 Z${n(plan.start.z)}`, 'M5', 'M2');
  return `${lines.join('\n')}\n`;
}

function moveLine(move: ToolMove, n: (value: number) => string): string {
  const { x, y, z } = move.to;
  switch (move.kind) {
    case 'rapid':
      return `G0 X${n(x)} Y${n(y)} Z${n(z)}`;
    case 'retract':
      return `G0 Z${n(z)}`;
    case 'plunge':
    case 'cut':
      return `G1 X${n(x)} Y${n(y)} Z${n(z)}`;
  }
}

function number(value: number, units: LengthUnit): string {
  const text = value.toFixed(DECIMALS[units]);
  // "-0.0000" is written "0.0000".
  return text.charCodeAt(0) === 45 && Number(text) === 0 ? text.slice(1) : text;
}

/** Comment lines: plain ASCII, no parentheses inside, wrapped to COMMENT_WIDTH. */
function comments(texts: readonly string[]): string[] {
  const lines: string[] = [];
  for (const text of texts) {
    const clean = text.replace(/[()]/g, '').replace(/[–—]/g, '-').replace(/’/g, "'").replace(/[^\x20-\x7e]/g, '?').replace(/\s+/g, ' ');
    let line = '';
    for (const word of clean.split(' ')) {
      if (line && line.length + 1 + word.length > COMMENT_WIDTH) {
        lines.push(`(${line})`);
        line = word;
      } else line = line ? `${line} ${word}` : word;
    }
    if (line) lines.push(`(${line})`);
  }
  return lines;
}
