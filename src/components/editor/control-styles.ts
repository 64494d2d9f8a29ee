/** Tailwind class lists shared by the editor's controls, so buttons and fields look alike. */
export const BUTTON =
  'rounded border border-ink-faint bg-white px-2 py-1 text-sm text-ink hover:bg-paper-shade aria-pressed:bg-spruce-light aria-pressed:border-spruce disabled:opacity-50';
export const PRIMARY_BUTTON = 'rounded bg-spruce px-3 py-1 text-sm font-semibold text-white hover:bg-spruce-dark';
export const INPUT =
  'w-full rounded border border-ink-faint bg-white px-2 py-1 font-mono text-sm aria-[invalid=true]:border-rosewood aria-[invalid=true]:border-2';
export const FIELD_ERROR = 'mt-0.5 text-xs font-semibold text-rosewood';
