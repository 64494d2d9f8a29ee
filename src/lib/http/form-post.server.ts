/** One step for every form page: read the fields, validate them with the form's zod schema. */
import type { z } from 'zod';
import { readFormFields } from './form-body.server.ts';
import { zodIssues } from './problem.ts';

export type FormErrors = Partial<Record<string, string>>;

export type ParsedForm<T> =
  | { ok: true; data: T; raw: Record<string, unknown>; response?: undefined }
  /** `response` is set when the body itself was refused (413, 415, unreadable). */
  | { ok: false; response?: Response; errors: FormErrors; raw: Record<string, unknown> };

/** The first message for each field, keyed by its top-level name. */
export function formErrors(error: z.ZodError): FormErrors {
  const errors: FormErrors = {};
  for (const issue of zodIssues(error)) errors[issue.path.split('.')[0]!] ??= issue.message;
  return errors;
}

export async function parseForm<S extends z.ZodTypeAny>(request: Request, schema: S): Promise<ParsedForm<z.output<S>>> {
  const body = await readFormFields(request);
  if (!body.ok) return { ok: false, response: body.response, errors: {}, raw: {} };
  const parsed = schema.safeParse(body.value);
  if (!parsed.success) return { ok: false, errors: formErrors(parsed.error), raw: body.value };
  return { ok: true, data: parsed.data, raw: body.value };
}

/** A submitted field as text for refilling the form (never a password). */
export function textOf(raw: Record<string, unknown>, name: string): string {
  const value = raw[name];
  return typeof value === 'string' ? value.slice(0, 300) : '';
}
