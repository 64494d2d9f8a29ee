/**
 * A proof's deposit in the builder's list: what was asked, and whether the payment service has
 * confirmed payment (only its webhook says "deposit paid"). The owner may refund all or part of
 * a paid deposit here; a refund shows as pending until the service confirms it.
 */
import { useState, type SubmitEvent } from 'react';
import { minorFromText } from '~/lib/payments/amount-text.ts';
import { refundableMinor } from '~/lib/payments/deposit-state.ts';
import { formatMoney } from '~/lib/payments/money.ts';
import { DEPOSIT_STATE_LABELS, type DepositSummary } from '~/lib/schemas/deposit.ts';

interface Props {
  proofId: number;
  clientName: string;
  deposit: DepositSummary | null;
  approved: boolean;
  canRefund: boolean;
  /** Asks for the refund; resolves to an error message, or null when it was accepted. */
  onRefund: (proofId: number, amountMinor: number | undefined) => Promise<string | null>;
}

export default function DepositCell({ proofId, clientName, deposit, approved, canRefund, onRefund }: Props) {
  const [amount, setAmount] = useState('');
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (!deposit) return <span className="text-ink-soft">none</span>;
  const money = (minor: number) => formatMoney({ minor, currency: deposit.currency });
  const left = refundableMinor(deposit);
  const paid = deposit.state !== 'awaiting_payment';

  async function refund(event: SubmitEvent) {
    event.preventDefault();
    setFailure(null);
    let minor: number | undefined;
    if (amount.trim()) {
      const read = minorFromText(amount, deposit!.currency);
      if (!read.ok) {
        setFailure(`Refund amount ${read.message}`);
        return;
      }
      minor = read.minor;
    }
    if (!window.confirm(`Refund ${money(minor ?? left)} to ${clientName}?`)) return;
    setBusy(true);
    const problem = await onRefund(proofId, minor);
    setBusy(false);
    if (problem) setFailure(problem);
    else setAmount('');
  }

  return (
    <div className="space-y-1" data-deposit-state={deposit.state}>
      <p className="font-mono">{money(deposit.amountMinor)}</p>
      <p>
        {paid ? `${DEPOSIT_STATE_LABELS[deposit.state]}: ${money(deposit.paidMinor)}` : approved ? 'approved, deposit not paid yet' : 'asked on approval'}
        {deposit.paidAt && <span className="text-xs text-ink-soft"> ({deposit.paidAt.slice(0, 10)})</span>}
      </p>
      {paid && deposit.paidMinor !== deposit.amountMinor && <p className="text-sm text-caution">Paid {money(deposit.paidMinor)} of {money(deposit.amountMinor)} asked</p>}
      {deposit.refundedMinor > 0 && <p className="text-sm">Refunded {money(deposit.refundedMinor)}</p>}
      {deposit.refundPendingMinor > 0 && <p className="text-sm text-ink-soft">Refund of {money(deposit.refundPendingMinor)} waiting for the payment service</p>}
      {deposit.otherPayments.map((p, i) => <p key={i} className="text-sm text-caution">Also paid {formatMoney(p)} (another currency)</p>)}
      {canRefund && left > 0 && (
        <form onSubmit={(e) => void refund(e)} className="flex flex-wrap items-end gap-1" aria-label={`Refund the deposit of ${clientName}`}>
          <label className="text-xs">
            Refund amount ({deposit.currency}; empty: all {money(left)})
            <input className="block w-28 rounded border border-paper-line px-1 font-mono" inputMode="decimal" value={amount} onChange={(e) => setAmount(e.target.value)} />
          </label>
          <button className="rounded border border-rosewood px-2 py-0.5 text-sm text-rosewood disabled:opacity-50" disabled={busy}>Refund</button>
        </form>
      )}
      {failure && <p className="text-sm text-rosewood" role="alert">{failure}</p>}
    </div>
  );
}
