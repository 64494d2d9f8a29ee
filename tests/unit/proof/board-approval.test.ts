import { describe, expect, it } from 'vitest';
import { canonicalJson, designFingerprint } from '~/lib/boards/fingerprint.server.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import { approvalWarning, boardApproval, type ProofFact } from '~/lib/proofs/board-approval.ts';

const at = (minute: number) => new Date(Date.UTC(2026, 11, 3, 10, minute));
function proof(revision: number, fingerprint: string, decision: ProofFact['decision'], minute: number, revoked = false): ProofFact {
  return { revision, fingerprint, decision, decidedAt: decision ? at(minute) : null, createdAt: at(minute - 1), revoked };
}

describe('boardApproval: what the proofs say about the board as it is now', () => {
  it('no proofs: draft; an open proof of this layout: shared', () => {
    expect(boardApproval([], 'A')).toEqual({ status: 'draft', approval: null });
    expect(boardApproval([proof(1, 'A', null, 1)], 'A')).toEqual({ status: 'shared', approval: null });
  });

  it('approved only while the layout is the approved one; changed since approval after', () => {
    const proofs = [proof(1, 'A', 'approved', 1)];
    expect(boardApproval(proofs, 'A')).toEqual({ status: 'approved', approval: { revision: 1, fingerprint: 'A' } });
    expect(boardApproval(proofs, 'B')).toEqual({ status: 'changed_since_approval', approval: { revision: 1, fingerprint: 'A' } });
  });

  it('a rejected later layout leaves the earlier approval standing; its own answer speaks for it', () => {
    const proofs = [proof(1, 'A', 'approved', 1), proof(2, 'B', 'changes_requested', 5)];
    expect(boardApproval(proofs, 'B').status).toBe('changes_requested');
    expect(boardApproval(proofs, 'A').status).toBe('approved');
    expect(boardApproval(proofs, 'C')).toEqual({ status: 'changed_since_approval', approval: { revision: 1, fingerprint: 'A' } });
  });

  it('changes asked later for the same layout withdraw its approval; revoked proofs say nothing', () => {
    expect(boardApproval([proof(1, 'A', 'approved', 1), proof(1, 'A', 'changes_requested', 9)], 'A')).toEqual({ status: 'changes_requested', approval: null });
    expect(boardApproval([proof(1, 'A', null, 1, true)], 'A')).toEqual({ status: 'draft', approval: null });
  });

  it('the builder is warned only while the board differs from the approved layout', () => {
    expect(approvalWarning(null, 'A')).toBeNull();
    expect(approvalWarning({ revision: 7, fingerprint: 'A' }, 'A')).toBeNull();
    expect(approvalWarning({ revision: 7, fingerprint: 'A' }, 'B')).toMatch(/^The client approved revision 7 \(A\)/);
  });
});

describe('designFingerprint', () => {
  const design = DEMO_DESIGNS[0]!.design;
  it('is three groups of four hex digits, the same whatever the key order or the name', () => {
    const fingerprint = designFingerprint(design);
    expect(fingerprint).toMatch(/^[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}$/);
    const reordered = Object.fromEntries(Object.entries(design).reverse());
    expect(designFingerprint(reordered)).toBe(fingerprint);
    expect(designFingerprint({ ...design, name: 'Another name' })).toBe(fingerprint);
  });

  it('changes with any layout field', () => {
    expect(designFingerprint({ ...design, perpendicularFret: design.perpendicularFret + 1 })).not.toBe(designFingerprint(design));
    expect(designFingerprint({ ...design, slot: { ...design.slot, width: design.slot.width + 1e-9 } })).not.toBe(designFingerprint(design));
  });

  it('canonical JSON sorts keys at every depth', () => {
    expect(canonicalJson({ b: 1, a: { d: [2, { f: 1, e: 0 }], c: null } })).toBe('{"a":{"c":null,"d":[2,{"e":0,"f":1}]},"b":1}');
  });
});
