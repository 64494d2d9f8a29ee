/**
 * The shop's Fret wire list: a table of the wire the shop uses, a form to add one, and edit and
 * remove per row. Sizes in millimetres. Owners and builders only (the page and the API check).
 */
import { useState, type SyntheticEvent } from 'react';
import type { FretWire } from '~/lib/schemas/fret-wire.ts';
import { useHydrated } from '~/components/ui/use-hydrated.ts';
import { BUTTON, FIELD_ERROR, INPUT, PRIMARY_BUTTON } from '~/components/editor/control-styles.ts';

const SIZE_FIELDS = [
  ['crownWidthMm', 'Crown width (mm)'],
  ['crownHeightMm', 'Crown height (mm)'],
  ['tangWidthMm', 'Tang width (mm)'],
  ['tangDepthMm', 'Tang depth (mm)'],
  ['barbWidthMm', 'Barb width (mm)'],
  ['stockLengthMm', 'Stock length (mm)'],
] as const;

type Problem = { message: string; field?: string | undefined };

async function send(method: 'POST' | 'PUT' | 'DELETE', url: string, body?: unknown): Promise<{ ok: true; wire?: FretWire } | { ok: false; problem: Problem }> {
  const response = await fetch(url, { method, headers: { 'content-type': 'application/json' }, ...(body === undefined ? {} : { body: JSON.stringify(body) }) });
  if (response.status === 204) return { ok: true };
  const answer = (await response.json().catch(() => ({}))) as FretWire & { error?: string; field?: string };
  return response.ok ? { ok: true, wire: answer } : { ok: false, problem: { message: answer.error ?? `Request failed (${response.status})`, field: answer.field } };
}

function fromForm(form: HTMLFormElement): Record<string, unknown> {
  const data = new FormData(form);
  const text = (name: string) => String(data.get(name) ?? '').trim();
  const number = (name: string) => (text(name) === '' ? undefined : Number(text(name)));
  return { name: text('name'), source: text('source'), ...Object.fromEntries(SIZE_FIELDS.map(([key]) => [key, number(key)])) };
}

function WireForm({ wire, onSaved, onCancel }: { wire: FretWire | null; onSaved: (wire: FretWire) => void; onCancel?: () => void }) {
  const hydrated = useHydrated();
  const [problem, setProblem] = useState<Problem | null>(null);
  const id = wire ? `wire-${wire.id}` : 'wire-new';

  async function submit(event: SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const result = await send(wire ? 'PUT' : 'POST', wire ? `/api/fret-wire/${wire.id}` : '/api/fret-wire', fromForm(form));
    if (!result.ok) return setProblem(result.problem);
    setProblem(null);
    if (!wire) form.reset();
    onSaved(result.wire!);
  }

  const field = (name: string, label: string, value: string | number | undefined, numeric: boolean) => (
    <label key={name} className="flex flex-col gap-1 text-sm">
      {label}
      <input
        name={name}
        defaultValue={value ?? ''}
        inputMode={numeric ? 'decimal' : undefined}
        className={INPUT}
        aria-invalid={problem?.field === name}
        aria-describedby={problem?.field === name ? `${id}-error` : undefined}
      />
    </label>
  );
  return (
    <form onSubmit={submit} aria-label={wire ? `Edit ${wire.name}` : 'Add fret wire'} noValidate>
      <fieldset disabled={!hydrated} className="grid gap-2 sm:grid-cols-4">
        <legend className="sr-only">{wire ? `Edit ${wire.name}` : 'Add fret wire'}</legend>
        {field('name', 'Name', wire?.name, false)}
        {SIZE_FIELDS.map(([key, label]) => field(key, label, wire?.[key], true))}
        {field('source', 'Where the sizes come from', wire?.source, false)}
        <div className="flex items-end gap-2">
          <button type="submit" className={PRIMARY_BUTTON}>{wire ? 'Save' : 'Add wire'}</button>
          {onCancel && <button type="button" className={BUTTON} onClick={onCancel}>Cancel</button>}
        </div>
      </fieldset>
      {problem && <p id={`${id}-error`} role="alert" className={FIELD_ERROR}>{problem.message}</p>}
    </form>
  );
}

export default function FretWireList({ initial }: { initial: FretWire[] }) {
  const [wires, setWires] = useState(initial);
  const [editing, setEditing] = useState<number | null>(null);
  const [notice, setNotice] = useState('');
  const saved = (wire: FretWire) => {
    setWires((list) => [...list.filter((w) => w.id !== wire.id), wire].sort((a, b) => a.name.localeCompare(b.name)));
    setEditing(null);
    setNotice(`Saved ${wire.name}.`);
  };
  async function remove(wire: FretWire) {
    const result = await send('DELETE', `/api/fret-wire/${wire.id}`);
    if (!result.ok) return setNotice(result.problem.message);
    setWires((list) => list.filter((w) => w.id !== wire.id));
    setNotice(`Removed ${wire.name}; boards that named it now have no wire.`);
  }
  return (
    <div className="space-y-4">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Fret wire the shop uses, sizes in millimetres</caption>
        <thead>
          <tr className="border-b border-paper-line text-left">
            <th className="py-1">No.</th>
            <th>Name</th>
            {SIZE_FIELDS.map(([key, label]) => <th key={key}>{label}</th>)}
            <th>Source</th>
            <th><span className="sr-only">Actions</span></th>
          </tr>
        </thead>
        <tbody>
          {wires.map((wire) =>
            editing === wire.id ? (
              <tr key={wire.id}><td colSpan={10} className="py-2"><WireForm wire={wire} onSaved={saved} onCancel={() => setEditing(null)} /></td></tr>
            ) : (
              <tr key={wire.id} className="border-b border-paper-line">
                <td className="py-1 font-mono">{wire.id}</td>
                <td>{wire.name}</td>
                {SIZE_FIELDS.map(([key]) => <td key={key} className="font-mono">{wire[key].toFixed(2)}</td>)}
                <td className="text-ink-soft">{wire.source}</td>
                <td className="flex gap-1 py-1">
                  <button type="button" className={BUTTON} onClick={() => setEditing(wire.id)} aria-label={`Edit ${wire.name}`}>Edit</button>
                  <button type="button" className={BUTTON} onClick={() => void remove(wire)} aria-label={`Remove ${wire.name}`}>Remove</button>
                </td>
              </tr>
            ),
          )}
        </tbody>
      </table>
      {notice && <p role="status" className="text-sm">{notice}</p>}
      <section aria-labelledby="add-wire" className="rounded border border-paper-line bg-white p-3">
        <h2 id="add-wire" className="mb-2 font-semibold">Add fret wire</h2>
        <WireForm wire={null} onSaved={saved} />
      </section>
    </div>
  );
}
