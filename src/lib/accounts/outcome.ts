/** What an account action returns: a value, or a status with messages for the form's fields. */
export type FieldErrors = Partial<Record<string, string>>;

export type Outcome<T = undefined> =
  | { ok: true; value: T }
  | { ok: false; status: number; errors: FieldErrors; message?: string };

export const done = <T>(value: T): Outcome<T> => ({ ok: true, value });

export const refused = (status: number, errors: FieldErrors, message?: string): Outcome<never> =>
  message === undefined ? { ok: false, status, errors } : { ok: false, status, errors, message };
