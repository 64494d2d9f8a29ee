import { useEffect, useState, type FormEvent } from 'react';
import { INSTRUMENT_TYPES, type BoardDetail, type InstrumentType } from '~/lib/schemas/board.ts';
import { INSTRUMENT_LABELS } from './board-labels.ts';
import { BoardRequestError, saveBoardDetails } from './board-requests.ts';

interface Props {
  board: { id: number; clientName: string; instrumentType: string };
  /** The board version the editor has; null while the editor still has edits to autosave. */
  version: number | null;
  onSaved: (board: BoardDetail) => void;
}

const input = 'rounded border border-paper-line bg-white px-2 py-1 text-sm';

/**
 * Who the board is for and what instrument it is: shown in Boards and searchable there. Saved on
 * its own (no revision: these are not part of the layout), once the editor's edits are saved.
 */
export function BoardDetailsForm({ board, version, onSaved }: Props) {
  const [clientName, setClientName] = useState(board.clientName);
  const [instrumentType, setInstrumentType] = useState(board.instrumentType);
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  useEffect(() => {
    setClientName(board.clientName);
    setInstrumentType(board.instrumentType);
  }, [board.id, board.clientName, board.instrumentType]);
  const changed = clientName.trim() !== board.clientName || instrumentType !== board.instrumentType;

  const save = async (event: FormEvent) => {
    event.preventDefault();
    if (version === null) return;
    try {
      onSaved(await saveBoardDetails(board.id, version, { clientName: clientName.trim(), instrumentType: instrumentType as InstrumentType }));
      setMessage({ kind: 'ok', text: 'Client and instrument saved.' });
    } catch (e) {
      setMessage({ kind: 'error', text: e instanceof BoardRequestError ? e.message : 'The server could not be reached; nothing was saved.' });
    }
  };

  return (
    <form onSubmit={(e) => void save(e)} aria-label="Client and instrument" className="flex flex-wrap items-end gap-3 rounded border border-paper-line bg-white px-3 py-2 text-sm">
      <label className="flex flex-col">
        Client
        <input className={input} value={clientName} maxLength={120} onChange={(e) => setClientName(e.target.value)} autoComplete="off" />
      </label>
      <label className="flex flex-col">
        Instrument
        <select className={input} value={instrumentType} onChange={(e) => setInstrumentType(e.target.value)}>
          {INSTRUMENT_TYPES.map((type) => <option key={type} value={type}>{INSTRUMENT_LABELS[type]}</option>)}
        </select>
      </label>
      <button type="submit" className={input} disabled={!changed || version === null}>Save client and instrument</button>
      <span role="status" className={message?.kind === 'error' ? 'text-rosewood' : 'text-spruce'}>
        {version === null && changed ? 'Waiting for the autosave…' : message?.text}
      </span>
    </form>
  );
}
