/**
 * The pieces every Boards API route shares: the role check, the board id from the URL (and the
 * board it names), design validation with field paths, and one mapping from a write's outcome to
 * a status code.
 */
import { parseRecordId } from '~/lib/http/record-id.ts';
import { CAN, type SessionUser } from '~/lib/auth/index.server.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { getBoard, type WriteFailure, type WriteResult } from '~/lib/boards/boards.server.ts';
import { failureAnswer, type FailureAnswers } from '~/lib/http/result.ts';
import { json, problem, type Checked, type FieldIssue } from '~/lib/http/problem.ts';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import { validateDesign, type Design } from '~/lib/schemas/design.ts';

const NOT_FOUND = 'No such board in your shop';

export function boardNotFound(): Response {
  return problem(404, NOT_FOUND);
}


/**
 * What every `/api/boards/{id}` route starts with: the role check (Owners and Builders; Clients
 * get 403, visitors 401), then the board id (bad = 404).
 */
export function boardTarget(user: SessionUser | null, param: string | undefined): Checked<{ user: SessionUser; id: number }> {
  const guard = requireRole(user, CAN.design);
  if (!guard.ok) return guard;
  const id = parseRecordId(param);
  return id === null ? { ok: false, response: boardNotFound() } : { ok: true, value: { user: guard.value, id } };
}

/**
 * For the routes that read one board: the guard, the board id, the optional `revision` query
 * parameter (undefined = current; a bad one is a 400 naming it) and the board in the user's shop.
 */
export async function requestedBoard(
  user: SessionUser | null,
  idParam: string | undefined,
  revisionParam: string | null | undefined,
): Promise<Checked<{ user: SessionUser; board: BoardDetail; revision: number | undefined }>> {
  const target = boardTarget(user, idParam);
  if (!target.ok) return target;
  const revision = revisionParam === null || revisionParam === undefined ? undefined : parseRecordId(revisionParam);
  if (revision === null) return { ok: false, response: problem(400, 'revision must be a whole number from 1', { field: 'revision' }) };
  const board = await getBoard(target.value.user.shopId, target.value.id, revision);
  return board ? { ok: true, value: { user: target.value.user, board, revision } } : { ok: false, response: boardNotFound() };
}

/** Validates a design, reporting issues under `prefix` (e.g. "design.scale.treble"; '' for none). */
export function checkDesign(value: unknown, prefix: string): { ok: true; design: Design } | { ok: false; issues: FieldIssue[] } {
  const result = validateDesign(value);
  if (result.ok) return result;
  return {
    ok: false,
    issues: result.issues.map((issue) => ({ path: withPrefix(prefix, issue.path), message: issue.message })),
  };
}

/**
 * A saved revision's design, typed. Stored designs were validated when saved, so a failure here
 * is a server fault (500), not bad input.
 */
export function storedDesign(value: unknown): Design {
  const result = validateDesign(value);
  if (!result.ok) throw new Error(`stored design no longer validates: ${result.issues[0]?.path}`);
  return result.design;
}

function withPrefix(prefix: string, path: string): string {
  if (!prefix) return path;
  return path === 'design' ? prefix : `${prefix}.${path}`;
}

/** 409 body: the version and board as they are now, so the client keeps its edit and can compare. */
export function conflict(current: BoardDetail): Response {
  return problem(409, 'This board was changed by someone else since you opened it', {
    currentVersion: current.version,
    current,
  });
}

/**
 * 409 with `code: "approval_change"`: the change would move the board off the layout the client
 * approved. The same request with `confirmApprovalChange: true` goes ahead.
 */
export function approvalChange(approval: { revision: number; fingerprint: string }): Response {
  return problem(409, `The client approved revision ${approval.revision}; this change will need a new proof`, {
    code: 'approval_change',
    field: 'confirmApprovalChange',
    approval,
  });
}

const WRITE_FAILURES: FailureAnswers<WriteFailure> = {
  not_found: () => boardNotFound(),
  conflict: (failure) => conflict(failure.current),
  no_such_revision: () => problem(404, 'This board has no such revision', { field: 'revision' }),
  approval: (failure) => approvalChange(failure.approval),
};

export function writeResponse(result: WriteResult<BoardDetail>, status = 200): Response {
  return result.ok ? json(result.value, status) : failureAnswer(result, WRITE_FAILURES);
}
