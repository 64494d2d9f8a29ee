/**
 * The Export panel's cut list: one row per slot (slot length, arc over the radius, wire to cut),
 * the totals and stock count, and the checks of the board's fret wire. The wire comes from the
 * shop's Fret wire list (GET /api/fret-wire, shop members only); visitors see the list without it.
 */
import { useEffect, useMemo, useState } from 'react';
import { cutList } from '~/lib/export/cut-list.ts';
import { formatLength } from '~/lib/format/units.ts';
import type { Layout } from '~/lib/geometry/layout.ts';
import type { Design } from '~/lib/schemas/design.ts';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';

type WireState = { state: 'loading' } | { state: 'none'; why: string } | { state: 'found'; wire: FretWire };

export function CutListTable({ design, layout, stockLength }: { design: Design; layout: Layout; stockLength: number | undefined }) {
  const [wire, setWire] = useState<WireState>({ state: 'loading' });
  const wireId = design.wire.id;
  useEffect(() => {
    if (wireId === 0) return setWire({ state: 'none', why: 'No fret wire chosen for this board (Layout, "Fret wire").' });
    let live = true;
    fetch('/api/fret-wire', { headers: { accept: 'application/json' } })
      .then(async (response) => {
        if (!live) return;
        if (!response.ok) return setWire({ state: 'none', why: "Sign in as a shop member to use the shop's fret wire list." });
        const found = ((await response.json()) as FretWire[]).find((w) => w.id === wireId);
        setWire(found ? { state: 'found', wire: found } : { state: 'none', why: `Fret wire ${wireId} is not on the shop's list.` });
      })
      .catch(() => live && setWire({ state: 'none', why: 'The fret wire list could not be reached.' }));
    return () => {
      live = false;
    };
  }, [wireId]);
  const chosen = wire.state === 'found' ? wire.wire : null;
  const list = useMemo(() => cutList(design, layout, chosen, stockLength), [design, layout, chosen, stockLength]);
  const len = (value: number) => formatLength(value, design.units);
  const u = design.units;
  return (
    <section aria-labelledby="cut-list-title" className="space-y-2">
      <h3 id="cut-list-title" className="text-sm font-medium">Fret wire cut list ({u})</h3>
      <p className="text-xs text-ink-soft">
        Wire = arc over the {design.radius.nut === 0 ? 'flat top (the slot length)' : 'radiused top'} + 2 × {formatLength(list.endAllowance, u, true)} end allowance.
      </p>
      <div className="max-h-64 overflow-auto" tabIndex={0} role="region" aria-label="Cut list table (scrolls)">
        <table className="w-full border-collapse font-mono text-xs">
          <caption className="sr-only">Cut list: slot, arc and wire length per fret, in {u}</caption>
          <thead>
            <tr className="border-b border-paper-line text-left font-sans">
              <th scope="col">Fret</th>
              <th scope="col">Slot length</th>
              <th scope="col">Arc length</th>
              <th scope="col">Wire length</th>
            </tr>
          </thead>
          <tbody>
            {list.rows.map((row) => (
              <tr key={row.fret}>
                <td>{row.fret}</td>
                <td>{len(row.slotLength)}</td>
                <td>{len(row.arcLength)}</td>
                <td>{len(row.wireLength)}</td>
              </tr>
            ))}
            <tr className="border-t border-paper-line font-semibold">
              <td>Total</td>
              <td>{len(list.totals.slotLength)}</td>
              <td>{len(list.totals.arcLength)}</td>
              <td>{len(list.totals.wireLength)}</td>
            </tr>
          </tbody>
        </table>
      </div>
      <p className="text-sm" data-testid="stock-count">
        {list.stock
          ? `${list.stock.pieces} stock piece${list.stock.pieces === 1 ? '' : 's'} of ${formatLength(list.stock.length, u, true)} (first-fit, longest piece first)`
          : 'No stock length: choose a fret wire or give a stock length.'}
        {list.tooLong.length > 0 && <span className="text-rosewood"> Longer than the stock: fret {list.tooLong.join(', ')}.</span>}
      </p>
      {wire.state === 'none' && <p className="text-xs text-ink-soft">{wire.why}</p>}
      {list.wire && (
        <div>
          <p className="text-sm">Fret wire: {list.wire.wire.name}{list.wire.wire.source ? ` (${list.wire.wire.source})` : ''}</p>
          <ul className="text-sm">
            {list.wire.checks.map((check) => (
              <li key={check.check} className={check.ok ? 'text-spruce' : 'text-rosewood'}>
                {check.ok ? 'OK: ' : 'Warning: '}
                {check.message}
              </li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}
