/**
 * "Pay the deposit" on an approved proof: asks the server for the payment service's pay page and
 * goes there. Shown again after a cancel or a declined card, until the service confirms payment.
 */
import { useState } from 'react';
import { useHydrated } from '~/components/ui/use-hydrated.ts';
import { startCheckout } from '~/lib/payments/go-to-checkout.ts';

interface Props {
  checkoutUrl: string;
  /** The amount as the page shows it ("€500.00"). */
  amountText: string;
}

export default function DepositPay({ checkoutUrl, amountText }: Props) {
  const hydrated = useHydrated();
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);

  async function pay() {
    setBusy(true);
    setFailure(null);
    const started = await startCheckout(checkoutUrl);
    if (started.ok) {
      window.location.assign(started.url);
      return;
    }
    setFailure(started.message);
    setBusy(false);
  }

  return (
    <div className="space-y-2">
      <button type="button" className="rounded bg-spruce px-3 py-1.5 font-semibold text-white disabled:opacity-50" disabled={!hydrated || busy} onClick={() => void pay()}>
        Pay the deposit ({amountText})
      </button>
      <p className="text-sm text-ink-soft">You will pay on the payment service's own page; your card details never reach the shop.</p>
      {failure && <p className="text-sm text-rosewood" role="alert">{failure}</p>}
    </div>
  );
}
