/**
 * What an account or member form action answers, for the page that shows it: done (the page then
 * redirects, POST/redirect/GET, to its "done" notice or to `next`), or refused with the status,
 * the message beside each field, a message for the whole form and what to refill. A refusal is a
 * value, not a thrown ActionError, so it keeps its own status (409, 429 with Retry-After, 502 …)
 * and the fields it names.
 */
import type { FormErrors } from './form-post.server.ts';

export type FormOutcome =
  | { ok: true; next?: string }
  | {
      ok: false;
      status: number;
      errors: FormErrors;
      message?: string;
      retryAfterSeconds?: number;
      /** The member or invitation row the refusal belongs to (Members page). */
      rowId?: string;
      /** What was typed, to fill the form in again (never a password). */
      values?: Record<string, string>;
      /** Answer with the bare status and no page (a row form whose hidden id could not be read). */
      blank?: true;
    };

export const formDone = (next?: string): FormOutcome => (next === undefined ? { ok: true } : { ok: true, next });

export function formRefused(status: number, errors: FormErrors, extra: Omit<Extract<FormOutcome, { ok: false }>, 'ok' | 'status' | 'errors'> = {}): FormOutcome {
  return { ok: false, status, errors, ...extra };
}
