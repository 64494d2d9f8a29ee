/**
 * JSON responses with one shape for errors: `{ error, field?, issues? }` and the right status, and
 * the one result every step of a route returns (`Checked`): its value, or the Response to send.
 */
import type { ZodError } from 'zod';

/** What a route step gives back: the value to go on with, or the answer (4xx/5xx) to send as it is. */
export type Checked<T> = { ok: true; value: T } | { ok: false; response: Response };

export interface FieldIssue {
  path: string;
  message: string;
}

const JSON_HEADERS = { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' };

export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(data), { status, headers: { ...JSON_HEADERS, ...headers } });
}

/** An error response; `extra` may carry `field`, `issues`, `line` or anything the client shows. */
export function problem(status: number, message: string, extra: Record<string, unknown> = {}, headers: Record<string, string> = {}): Response {
  return json({ error: message, ...extra }, status, headers);
}

export function zodIssues(error: ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ path: i.path.join('.') || '(body)', message: i.message }));
}

/** 400 naming the first failing field in `error` and listing every issue. */
export function invalid(issues: FieldIssue[]): Response {
  const first = issues[0];
  const message = first ? `${first.path}: ${first.message}` : 'Invalid request';
  return problem(400, message, { field: first?.path, issues });
}
