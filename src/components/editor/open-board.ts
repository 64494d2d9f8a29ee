import type { BoardSummary } from '~/lib/schemas/board.ts';

/** What the editor shows of an open board beside its design. */
export type OpenBoard = Pick<
  BoardSummary,
  'id' | 'name' | 'status' | 'version' | 'currentRevision' | 'workingRevision' | 'fingerprint' | 'approval' | 'clientName' | 'instrumentType'
>;

export function openBoard(board: BoardSummary): OpenBoard {
  const { id, name, status, version, currentRevision, workingRevision, fingerprint, approval, clientName, instrumentType } = board;
  return { id, name, status, version, currentRevision, workingRevision, fingerprint, approval, clientName, instrumentType };
}
