import type { BoardSummary } from '~/lib/schemas/board.ts';
import type { AutosaveState } from './autosave-state.ts';

interface Props {
  board: Pick<BoardSummary, 'status' | 'approval' | 'fingerprint'>;
  state: AutosaveState;
  /** Keep the change (the board will need a new proof). */
  onKeep: () => void;
  /** Go back to the approved layout (the board as saved). */
  onUndo: () => void;
}

const button = 'rounded border border-paper-line bg-white px-2 py-1 text-sm';

/**
 * What the client's approval means for the board in the editor: a question before the first
 * change that moves it off the approved layout, a warning while it differs from that layout, and
 * a note while it is exactly the approved one.
 */
export function ApprovalNotice({ board, state, onKeep, onUndo }: Props) {
  const approval = state.approval ?? board.approval;
  if (!approval) return null;
  const which = (
    <>
      revision <span className="font-mono">{approval.revision}</span> (fingerprint <span className="font-mono">{approval.fingerprint}</span>)
    </>
  );
  if (state.status === 'approval') {
    return (
      <section role="alertdialog" aria-labelledby="approval-question" aria-describedby="approval-question-text" className="space-y-2 rounded border border-caution bg-caution-light p-3">
        <h2 id="approval-question" className="font-semibold">The client approved this board as it is</h2>
        <p id="approval-question-text" className="text-sm">
          The client approved {which}; this change will need a new proof. Your change is kept here and not saved yet.
        </p>
        <div className="flex flex-wrap gap-2">
          <button type="button" className={button} onClick={onKeep} autoFocus>Keep my change (needs a new proof)</button>
          <button type="button" className={button} onClick={onUndo}>Undo my change</button>
        </div>
      </section>
    );
  }
  if (board.status === 'changed_since_approval' || board.fingerprint !== approval.fingerprint) {
    return (
      <p role="status" className="rounded border border-caution bg-caution-light p-2 text-sm" data-approval="changed">
        <strong>Changed since approval.</strong> The client approved {which}; this board now differs from it. Send a new proof before
        cutting from it: exports say so on every print.
      </p>
    );
  }
  return (
    <p role="status" className="rounded border border-spruce bg-spruce-light p-2 text-sm" data-approval="approved">
      Approved by the client: {which}. A change to the layout will need a new proof.
    </p>
  );
}
