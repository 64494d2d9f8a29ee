/**
 * What a board's proofs say about the board as it is now. A proof pins one revision and that
 * revision's fingerprint; the client's answer speaks for that exact layout and no other. So:
 * - the board is "approved" only while its working copy has the fingerprint the client approved
 *   (restoring exactly the approved revision makes it approved again);
 * - after any change it is "changed since approval" until a proof of the new layout is answered;
 * - an answer or an open proof for the current layout speaks first; answers for other layouts
 *   only colour a board that has no proof of its own.
 * Revoked proofs say nothing. Pure: the database layer feeds it rows and stores what it returns.
 */
import type { StoredBoardStatus } from '~/lib/schemas/board.ts';

export interface ProofFact {
  revision: number;
  fingerprint: string;
  decision: 'approved' | 'changes_requested' | null;
  decidedAt: Date | null;
  createdAt: Date;
  revoked: boolean;
}

/** The client's standing approval: the newest layout whose latest answer is "approved". */
export interface Approval {
  revision: number;
  fingerprint: string;
}

export interface BoardApproval {
  status: StoredBoardStatus;
  approval: Approval | null;
}

export function boardApproval(proofs: readonly ProofFact[], workingFingerprint: string): BoardApproval {
  const live = proofs.filter((p) => !p.revoked);
  const answered = live
    .filter((p): p is ProofFact & { decidedAt: Date } => p.decision !== null && p.decidedAt !== null)
    .sort((a, b) => b.decidedAt.getTime() - a.decidedAt.getTime());
  const latestAnswer = new Map<string, ProofFact>();
  for (const p of answered) if (!latestAnswer.has(p.fingerprint)) latestAnswer.set(p.fingerprint, p);
  const standing = [...latestAnswer.values()].find((p) => p.decision === 'approved');
  const approval = standing ? { revision: standing.revision, fingerprint: standing.fingerprint } : null;

  const forThisLayout = latestAnswer.get(workingFingerprint);
  if (forThisLayout?.decision) return { status: forThisLayout.decision, approval };
  if (live.some((p) => p.decision === null && p.fingerprint === workingFingerprint)) return { status: 'shared', approval };
  if (approval) return { status: 'changed_since_approval', approval };
  if (answered.some((p) => p.decision === 'changes_requested')) return { status: 'changes_requested', approval };
  if (live.some((p) => p.decision === null)) return { status: 'shared', approval };
  return { status: 'draft', approval };
}

/** The builder's warning while the board differs from what the client approved; null when it does not. */
export function approvalWarning(approval: Approval | null, workingFingerprint: string): string | null {
  if (!approval || approval.fingerprint === workingFingerprint) return null;
  return `The client approved revision ${approval.revision} (${approval.fingerprint}); this board has changed since. Send a new proof before cutting from it.`;
}
