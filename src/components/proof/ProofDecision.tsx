/**
 * The client's two answers on a proof: approve (typed name and a ticked confirmation) or request
 * changes (typed name and a comment). Posts JSON to `action`, then reloads so the page shows the
 * recorded answer; after an approval of a proof with a deposit it goes on to the payment
 * service's pay page instead (the approval is recorded first and stands either way).
 */
import { useState, type SubmitEvent } from 'react';
import { useHydrated } from '~/components/ui/use-hydrated.ts';
import { startCheckout } from '~/lib/payments/go-to-checkout.ts';
import { PROOF_LIMITS } from '~/lib/schemas/proof.ts';

interface Props {
  action: string;
  /** Set when the proof asks for a deposit: where to get the pay page after approving. */
  checkoutAfterApproval?: string | undefined;
}

interface Failure {
  message: string;
  field?: string | undefined;
}

/** The server validates the answer; the body is what the form holds. */
async function send(action: string, body: Record<string, unknown>): Promise<Failure | null> {
  const response = await fetch(action, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(body),
    // The page sends no Referer anywhere; this request still needs its Origin for the CSRF check.
    referrerPolicy: 'strict-origin',
    credentials: 'same-origin',
  });
  if (response.ok) return null;
  const data = (await response.json().catch(() => ({}))) as { error?: string; field?: string };
  return { message: data.error ?? `The answer could not be recorded (${response.status})`, field: data.field };
}

function FieldError({ failure, field }: { failure: Failure | null; field: string }) {
  if (!failure || failure.field !== field) return null;
  return <p className="mt-1 text-sm text-rosewood" role="alert">{failure.message}</p>;
}

const inputClass = 'mt-1 block w-full rounded border border-paper-line bg-white px-2 py-1';
const buttonClass = 'rounded px-3 py-1.5 font-semibold text-white disabled:opacity-50';

export default function ProofDecision({ action, checkoutAfterApproval }: Props) {
  const hydrated = useHydrated();
  const [busy, setBusy] = useState(false);
  const [approveFailure, setApproveFailure] = useState<Failure | null>(null);
  const [changesFailure, setChangesFailure] = useState<Failure | null>(null);
  const [approveName, setApproveName] = useState('');
  const [confirmed, setConfirmed] = useState(false);
  const [changesName, setChangesName] = useState('');
  const [comment, setComment] = useState('');

  async function submit(event: SubmitEvent, body: Record<string, unknown>, setFailure: (f: Failure | null) => void) {
    event.preventDefault();
    setBusy(true);
    setFailure(null);
    const failure = await send(action, body).catch(() => ({ message: 'The connection failed; try again.' }));
    if (failure) {
      setFailure(failure);
      setBusy(false);
      return;
    }
    if (checkoutAfterApproval && body.decision === 'approved') {
      const started = await startCheckout(checkoutAfterApproval);
      // When the pay page cannot be had now, the reloaded page offers "Pay the deposit".
      if (started.ok) {
        window.location.assign(started.url);
        return;
      }
    }
    window.location.reload();
  }

  return (
    <section aria-labelledby="your-answer" className="space-y-3">
      <h2 id="your-answer" className="text-lg font-semibold">Your answer</h2>
      <div className="grid gap-4 md:grid-cols-2">
        <form
          aria-label="Approve"
          className="space-y-3 rounded border border-paper-line bg-white p-3"
          onSubmit={(e) => submit(e, { decision: 'approved', name: approveName, confirmed }, setApproveFailure)}
        >
          <fieldset className="space-y-3" disabled={!hydrated || busy}>
            <legend className="font-semibold">Approve</legend>
            <label className="block">
              Your name
              <input className={inputClass} required maxLength={PROOF_LIMITS.nameMaxChars} value={approveName}
                onChange={(e) => setApproveName(e.target.value)} autoComplete="name" />
            </label>
            <FieldError failure={approveFailure} field="name" />
            <label className="flex items-start gap-2">
              <input type="checkbox" required className="mt-1" checked={confirmed} onChange={(e) => setConfirmed(e.target.checked)} />
              <span>I have checked this layout and approve it; the shop may cut the fret slots to it.</span>
            </label>
            <FieldError failure={approveFailure} field="confirmed" />
            {approveFailure && !['name', 'confirmed'].includes(approveFailure.field ?? '') && (
              <p className="text-sm text-rosewood" role="alert">{approveFailure.message}</p>
            )}
            <button className={`${buttonClass} bg-spruce`}>Approve</button>
          </fieldset>
        </form>
        <form
          aria-label="Request changes"
          className="space-y-3 rounded border border-paper-line bg-white p-3"
          onSubmit={(e) => submit(e, { decision: 'changes_requested', name: changesName, comment }, setChangesFailure)}
        >
          <fieldset className="space-y-3" disabled={!hydrated || busy}>
            <legend className="font-semibold">Request changes</legend>
            <label className="block">
              Your name
              <input className={inputClass} required maxLength={PROOF_LIMITS.nameMaxChars} value={changesName}
                onChange={(e) => setChangesName(e.target.value)} autoComplete="name" />
            </label>
            <FieldError failure={changesFailure} field="name" />
            <label className="block">
              What should change? (up to {PROOF_LIMITS.commentMaxChars} characters)
              <textarea className={inputClass} rows={4} required maxLength={PROOF_LIMITS.commentMaxChars} value={comment}
                onChange={(e) => setComment(e.target.value)} />
            </label>
            <FieldError failure={changesFailure} field="comment" />
            {changesFailure && !['name', 'comment'].includes(changesFailure.field ?? '') && (
              <p className="text-sm text-rosewood" role="alert">{changesFailure.message}</p>
            )}
            <button className={`${buttonClass} bg-rosewood`}>Request changes</button>
          </fieldset>
        </form>
      </div>
    </section>
  );
}
