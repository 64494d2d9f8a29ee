/**
 * One step for every form: read the fields (from the request, or from the FormData an Astro Action
 * was given), validate them with the form's zod schema.
 */
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
  return parseFields(body.value, schema);
}

/** The text fields of a posted form, as readFormFields gives them (files are left out). */
export function fieldsOf(form: FormData): Record<string, unknown> {
  const fields: Record<string, unknown> = {};
  for (const [name, value] of form) if (typeof value === 'string') fields[name] = value;
  return fields;
}

export function parseFields<S extends z.ZodTypeAny>(fields: Record<string, unknown>, schema: S): ParsedForm<z.output<S>> {
  const parsed = schema.safeParse(fields);
  if (!parsed.success) return { ok: false, errors: formErrors(parsed.error), raw: fields };
  return { ok: true, data: parsed.data, raw: fields };
}

/** A submitted field as text for refilling the form (never a password). */
export function textOf(raw: Record<string, unknown>, name: string): string {
  const value = raw[name];
  return typeof value === 'string' ? value.slice(0, 300) : '';
}
