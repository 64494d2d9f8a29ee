/**
 * The builder's proof panel for one design: send a proof of the current revision to a client
 * (the link is shown once, to copy), see every proof with its state and answer, revoke a link.
 */
import { useCallback, useEffect, useState, type SubmitEvent } from 'react';
import { useHydrated } from '~/components/ui/use-hydrated.ts';
import { minorFromText } from '~/lib/payments/amount-text.ts';
import { currencyCodes } from '~/lib/payments/money.ts';
import { DEPOSIT_LIMITS, type DepositSettings } from '~/lib/schemas/deposit.ts';
import { PROOF_LIMITS, PROOF_STATE_LABELS, type CreatedProof, type ProofSummary } from '~/lib/schemas/proof.ts';
import DepositCell from './DepositCell.tsx';

interface Props {
  boardId: number;
}

interface Failure {
  message: string;
  field?: string | undefined;
}

async function call<T>(url: string, init?: RequestInit): Promise<{ ok: true; data: T } | { ok: false; failure: Failure }> {
  try {
    const response = await fetch(url, { credentials: 'same-origin', ...init });
    const data = (await response.json().catch(() => ({}))) as T & { error?: string; field?: string };
    if (response.ok) return { ok: true, data };
    return { ok: false, failure: { message: data.error ?? `Request failed (${response.status})`, field: data.field } };
  } catch {
    return { ok: false, failure: { message: 'The connection failed; try again.' } };
  }
}

const day = (iso: string) => iso.slice(0, 10);
const inputClass = 'mt-1 block w-full rounded border border-paper-line bg-white px-2 py-1';

function FieldError({ failure, field }: { failure: Failure | null; field: string }) {
  if (!failure || failure.field !== field) return null;
  return <p className="mt-1 text-sm text-rosewood" role="alert">{failure.message}</p>;
}

function CreatedLink({ created }: { created: CreatedProof }) {
  const [copied, setCopied] = useState(false);
  return (
    <div className="space-y-2 rounded border border-spruce bg-spruce-light p-3" role="status">
      <p className="font-semibold">
        Proof sent{created.mailed ? ` to ${created.proof.clientEmail}` : ', but the e-mail could not be sent: copy the link and send it yourself'}.
      </p>
      <label className="block text-sm">
        Link for the client (shown only now; it cannot be shown again)
        <input readOnly className={`${inputClass} font-mono`} value={created.link} onFocus={(e) => e.target.select()} />
      </label>
      <button type="button" className="rounded border border-spruce px-2 py-1 text-sm"
        onClick={() => navigator.clipboard.writeText(created.link).then(() => setCopied(true), () => setCopied(false))}>
        {copied ? 'Copied' : 'Copy link'}
      </button>
    </div>
  );
}

interface RowProps {
  proof: ProofSummary;
  onRevoke: (id: number) => void;
  canRefund: boolean;
  onRefund: (proofId: number, amountMinor: number | undefined) => Promise<string | null>;
}

function ProofRow({ proof, onRevoke, canRefund, onRefund }: RowProps) {
  return (
    <tr className="border-t border-paper-line align-top" data-proof-id={proof.id}>
      <td className="px-2 py-1">{proof.clientName}<br /><span className="text-xs text-ink-soft">{proof.clientEmail}</span></td>
      <td className="px-2 py-1 font-mono">{proof.revision}<br /><span className="text-xs text-ink-soft">{proof.fingerprint}</span></td>
      <td className="whitespace-nowrap px-2 py-1 font-mono">{day(proof.createdAt)}</td>
      <td className="whitespace-nowrap px-2 py-1 font-mono">{day(proof.expiresAt)}</td>
      <td className="px-2 py-1" data-label="state">{PROOF_STATE_LABELS[proof.state]}</td>
      <td className="px-2 py-1">
        {proof.decision ? (
          <>
            {proof.decision.kind === 'approved' ? 'Approved' : 'Changes requested'} by {proof.decision.name} on {day(proof.decision.at)}
            {proof.decision.comment && <p className="whitespace-pre-line text-sm text-ink-soft">{proof.decision.comment}</p>}
          </>
        ) : (
          <span className="text-ink-soft">none yet</span>
        )}
        {proof.revokedAt && <p className="text-sm text-ink-soft">Link revoked on {day(proof.revokedAt)}</p>}
      </td>
      <td className="px-2 py-1">
        <DepositCell proofId={proof.id} clientName={proof.clientName} deposit={proof.deposit} approved={proof.decision?.kind === 'approved'}
          canRefund={canRefund} onRefund={onRefund} />
      </td>
      <td className="px-2 py-1">
        {!proof.revokedAt && !proof.decision && (
          <button type="button" className="text-sm text-rosewood underline" onClick={() => onRevoke(proof.id)}
            aria-label={`Revoke the proof for ${proof.clientName}, revision ${proof.revision}`}>
            Revoke
          </button>
        )}
      </td>
    </tr>
  );
}

export default function ProofPanel({ boardId }: Props) {
  const hydrated = useHydrated();
  const [proofs, setProofs] = useState<ProofSummary[] | null>(null);
  const [listFailure, setListFailure] = useState<Failure | null>(null);
  const [formFailure, setFormFailure] = useState<Failure | null>(null);
  const [created, setCreated] = useState<CreatedProof | null>(null);
  const [busy, setBusy] = useState(false);
  const [clientName, setClientName] = useState('');
  const [clientEmail, setClientEmail] = useState('');
  const [message, setMessage] = useState('');
  const [expiresInDays, setExpiresInDays] = useState(String(PROOF_LIMITS.defaultExpiryDays));
  const [depositAmount, setDepositAmount] = useState('');
  const [depositCurrency, setDepositCurrency] = useState('');
  const [settings, setSettings] = useState<DepositSettings | null>(null);
  const depositsOffMessage = settings?.offMessage ?? null;
  const canRefund = settings?.canRefund ?? false;
  const [depositDescription, setDepositDescription] = useState('');
  const base = `/api/boards/${boardId}/proofs`;

  const reload = useCallback(async () => {
    const result = await call<{ proofs: ProofSummary[]; deposits: DepositSettings }>(base);
    if (result.ok) {
      setProofs(result.data.proofs);
      setSettings(result.data.deposits);
      setDepositCurrency((current) => current || result.data.deposits.defaultCurrency);
      setListFailure(null);
    } else setListFailure(result.failure);
  }, [base]);

  useEffect(() => {
    void reload();
  }, [reload]);

  async function create(event: SubmitEvent) {
    event.preventDefault();
    setBusy(true);
    setFormFailure(null);
    setCreated(null);
    let deposit: { amountMinor: number; currency: string; description: string } | undefined;
    if (depositAmount.trim()) {
      const read = minorFromText(depositAmount, depositCurrency);
      if (!read.ok) {
        setFormFailure({ message: `Deposit amount ${read.message}`, field: 'deposit.amountMinor' });
        setBusy(false);
        return;
      }
      deposit = { amountMinor: read.minor, currency: depositCurrency, description: depositDescription };
    }
    const result = await call<CreatedProof>(base, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ clientName, clientEmail, message, expiresInDays: Number(expiresInDays), ...(deposit ? { deposit } : {}) }),
    });
    setBusy(false);
    if (!result.ok) {
      setFormFailure(result.failure);
      return;
    }
    setCreated(result.data);
    setClientName('');
    setClientEmail('');
    setMessage('');
    setDepositAmount('');
    setDepositDescription('');
    await reload();
  }

  async function refund(proofId: number, amountMinor: number | undefined): Promise<string | null> {
    const result = await call<unknown>(`/api/proofs/${proofId}/deposit/refunds`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(amountMinor === undefined ? {} : { amountMinor }),
    });
    await reload();
    return result.ok ? null : result.failure.message;
  }

  async function revoke(id: number) {
    if (!window.confirm('Revoke this proof? Its link will stop working.')) return;
    const result = await call<{ proof: ProofSummary }>(`/api/proofs/${id}/revoke`, { method: 'POST' });
    if (!result.ok) setListFailure(result.failure);
    await reload();
  }

  const knownFields = ['clientName', 'clientEmail', 'message', 'expiresInDays', 'deposit.amountMinor', 'deposit.currency', 'deposit.description'];
  return (
    <section aria-labelledby="proofs-heading" className="space-y-4">
      <h2 id="proofs-heading" className="text-lg font-semibold">Proofs</h2>
      <form onSubmit={create} aria-label="Send a proof" className="rounded border border-paper-line bg-white p-3">
        <fieldset className="grid gap-3 md:grid-cols-2" disabled={!hydrated || busy}>
          <label className="block">
            Client name
            <input className={inputClass} required maxLength={PROOF_LIMITS.nameMaxChars} value={clientName} onChange={(e) => setClientName(e.target.value)} />
            <FieldError failure={formFailure} field="clientName" />
          </label>
          <label className="block">
            Client e-mail
            <input type="email" className={inputClass} required maxLength={PROOF_LIMITS.emailMaxChars} value={clientEmail} onChange={(e) => setClientEmail(e.target.value)} />
            <FieldError failure={formFailure} field="clientEmail" />
          </label>
          <label className="block md:col-span-2">
            Message to the client (optional)
            <textarea className={inputClass} rows={3} maxLength={PROOF_LIMITS.messageMaxChars} value={message} onChange={(e) => setMessage(e.target.value)} />
            <FieldError failure={formFailure} field="message" />
          </label>
          <label className="block">
            Link expires after (days)
            <input type="number" className={`${inputClass} font-mono`} required min={PROOF_LIMITS.minExpiryDays} max={PROOF_LIMITS.maxExpiryDays} step={1}
              value={expiresInDays} onChange={(e) => setExpiresInDays(e.target.value)} />
            <FieldError failure={formFailure} field="expiresInDays" />
          </label>
          <fieldset className="space-y-2 rounded border border-paper-line p-2 md:col-span-2">
            <legend className="px-1 text-sm font-semibold">Deposit on approval (optional)</legend>
            {depositsOffMessage ? (
              <p className="text-sm text-ink-soft">{depositsOffMessage}</p>
            ) : (
              <div className="grid gap-2 md:grid-cols-3">
                <label className="block">
                  Deposit amount ({depositCurrency})
                  <input className={`${inputClass} font-mono`} inputMode="decimal" value={depositAmount} onChange={(e) => setDepositAmount(e.target.value)} />
                  <FieldError failure={formFailure} field="deposit.amountMinor" />
                </label>
                <label className="block">
                  Deposit currency
                  <select className={inputClass} value={depositCurrency} onChange={(e) => setDepositCurrency(e.target.value)}>
                    {currencyCodes().map((code) => <option key={code} value={code}>{code}</option>)}
                  </select>
                  <FieldError failure={formFailure} field="deposit.currency" />
                </label>
                <label className="block">
                  What the deposit is for (optional)
                  <input className={inputClass} maxLength={DEPOSIT_LIMITS.descriptionMaxChars} value={depositDescription} onChange={(e) => setDepositDescription(e.target.value)} />
                  <FieldError failure={formFailure} field="deposit.description" />
                </label>
              </div>
            )}
          </fieldset>
          <div className="flex items-end">
            <button className="rounded bg-spruce px-3 py-1.5 font-semibold text-white disabled:opacity-50">
              Send proof of the current revision
            </button>
          </div>
          {formFailure && !knownFields.includes(formFailure.field ?? '') && (
            <p className="text-sm text-rosewood md:col-span-2" role="alert">{formFailure.message}</p>
          )}
        </fieldset>
      </form>
      {created && <CreatedLink created={created} />}
      {listFailure && <p className="text-sm text-rosewood" role="alert">{listFailure.message}</p>}
      {proofs === null ? (
        <p className="text-ink-soft">Loading proofs…</p>
      ) : proofs.length === 0 ? (
        <p className="text-ink-soft">No proofs sent for this design yet.</p>
      ) : (
        <div className="relative overflow-x-auto rounded border border-paper-line bg-white">
          <table className="w-full text-left text-sm" aria-label="Proofs of this design">
            <thead className="bg-paper-shade">
              <tr>
                <th scope="col" className="px-2 py-1">Client</th>
                <th scope="col" className="px-2 py-1">Revision</th>
                <th scope="col" className="px-2 py-1">Sent</th>
                <th scope="col" className="px-2 py-1">Expires</th>
                <th scope="col" className="px-2 py-1">Status</th>
                <th scope="col" className="px-2 py-1">Answer</th>
                <th scope="col" className="px-2 py-1">Deposit</th>
                <th scope="col" className="px-2 py-1"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {proofs.map((proof) => <ProofRow key={proof.id} proof={proof} onRevoke={(id) => void revoke(id)} canRefund={canRefund} onRefund={refund} />)}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
