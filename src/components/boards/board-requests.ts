/**
 * The Boards API as the browser calls it. Every function resolves with the parsed JSON of a 2xx
 * answer and rejects with a BoardRequestError carrying the status and the server's message.
 */
import type { BoardDetail, BoardList, BoardListQuery, BoardRevision } from '~/lib/schemas/board.ts';
import { searchFromListQuery } from './board-url-state.ts';

export class BoardRequestError extends Error {
  constructor(
    readonly status: number,
    message: string,
    /** The whole error body (a 409 carries `currentVersion` and `current`). */
    readonly body: Record<string, unknown>,
  ) {
    super(message);
  }
}

async function send<T>(path: string, init: RequestInit = {}): Promise<T> {
  const response = await fetch(path, { credentials: 'same-origin', ...init, headers: { accept: 'application/json', ...init.headers } });
  const body = (await response.json().catch(() => ({}))) as Record<string, unknown>;
  if (!response.ok) {
    const message = typeof body.error === 'string' ? body.error : `The server answered ${response.status}`;
    throw new BoardRequestError(response.status, message, body);
  }
  return body as T;
}

function post<T>(path: string, body: unknown, method = 'POST'): Promise<T> {
  return send<T>(path, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
}

export const fetchBoards = (query: BoardListQuery) => send<BoardList>(`/api/boards${searchFromListQuery(query)}`);
export const fetchBoard = (id: number) => send<BoardDetail>(`/api/boards/${id}`);
export const fetchRevisions = (id: number) => send<{ items: BoardRevision[] }>(`/api/boards/${id}/revisions`).then((r) => r.items);
export const createBoard = (design: unknown, extra: { clientName?: string; instrumentType?: string } = {}) =>
  post<BoardDetail>('/api/boards', { design, ...extra });
export const saveBoard = (id: number, version: number, design: unknown, options: { confirmApprovalChange?: boolean } = {}) =>
  post<BoardDetail>(`/api/boards/${id}`, { version, design, ...(options.confirmApprovalChange ? { confirmApprovalChange: true } : {}) }, 'PATCH');
/** Saves who the board is for and what instrument it is (no revision: not part of the layout). */
export const saveBoardDetails = (id: number, version: number, details: { clientName: string; instrumentType: string }) =>
  post<BoardDetail>(`/api/boards/${id}`, { version, ...details }, 'PATCH');
/** Keeps the board's working copy as a revision, with a note (a checkpoint a person chose). */
export const saveBoardRevision = (id: number, version: number, note: string) => post<BoardDetail>(`/api/boards/${id}/revisions`, { version, note });
export const duplicateBoard = (id: number) => send<BoardDetail>(`/api/boards/${id}/duplicate`, { method: 'POST' });
export const archiveBoard = (id: number, archived: boolean) => post<BoardDetail>(`/api/boards/${id}/archive`, { archived });
export const restoreBoardRevision = (id: number, revision: number, version: number, confirmApprovalChange = false) =>
  post<BoardDetail>(`/api/boards/${id}/restore`, { revision, version, ...(confirmApprovalChange ? { confirmApprovalChange: true } : {}) });

/** Uploads a chosen JSON file as a new board. */
export function importBoardFile(file: File): Promise<BoardDetail> {
  const form = new FormData();
  form.set('file', file);
  return send<BoardDetail>('/api/boards/import', { method: 'POST', body: form });
}
