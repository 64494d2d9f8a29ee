/**
 * The JSON file a board is exported to and imported from. Export writes the envelope below;
 * import accepts that envelope or a bare design, and always creates a new board.
 */
import type { FieldIssue } from '~/lib/http/problem.ts';
import { zodIssues } from '~/lib/http/problem.ts';
import { BOARD_FILE_KIND, boardFileSchema, type BoardDetail, type BoardFile } from '~/lib/schemas/board.ts';

/** The file of one revision of a board (exports always name one: exportRevision). */
export function boardFile(board: BoardDetail & { revision: number }): BoardFile & { revision: number; exportedAt: string } {
  return {
    kind: BOARD_FILE_KIND,
    instrumentType: board.instrumentType as BoardFile['instrumentType'],
    clientName: board.clientName,
    revision: board.revision,
    exportedAt: new Date().toISOString(),
    design: board.design,
  };
}

/**
 * Reads a parsed file: the envelope (its design issues are reported under "design.") or a bare
 * design (issues under the design's own field names).
 */
export function readBoardFile(value: unknown): { ok: true; file: BoardFile; designPrefix: string } | { ok: false; issues: FieldIssue[] } {
  const isEnvelope = typeof value === 'object' && value !== null && 'kind' in value;
  if (!isEnvelope) return { ok: true, file: { kind: BOARD_FILE_KIND, instrumentType: 'guitar', clientName: '', design: value }, designPrefix: '' };
  const parsed = boardFileSchema.safeParse(value);
  if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) };
  return { ok: true, file: parsed.data, designPrefix: 'design' };
}
