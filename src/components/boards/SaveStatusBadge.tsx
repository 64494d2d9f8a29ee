import { SAVE_STATUS_LABELS, type AutosaveState } from './autosave-state.ts';

const TONES: Readonly<Record<AutosaveState['status'], string>> = {
  saved: 'border-spruce bg-spruce-light text-spruce-dark',
  unsaved: 'border-paper-line bg-paper-shade text-ink',
  saving: 'border-paper-line bg-white text-ink-soft',
  conflict: 'border-caution bg-caution-light text-caution',
  approval: 'border-caution bg-caution-light text-caution',
  error: 'border-rosewood bg-rosewood-light text-rosewood',
};

/** The autosave state as a small badge; screen readers hear each change. */
export function SaveStatusBadge({ state }: { state: AutosaveState }) {
  return (
    <span role="status" aria-live="polite" className={`inline-block rounded border px-2 py-0.5 text-xs ${TONES[state.status]}`}
      title={state.error ?? undefined}>
      {SAVE_STATUS_LABELS[state.status]}
      {state.status === 'error' && state.error ? `: ${state.error}` : ''}
    </span>
  );
}
