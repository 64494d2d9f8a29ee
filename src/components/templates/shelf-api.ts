/** Browser calls to the Template shelf API; errors come back as the API's `{ error, field }`. */
import type { TemplatePage, TemplateView } from '~/lib/schemas/template.ts';

export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly field?: string,
  ) {
    super(message);
  }
}

async function parse<T>(response: Response): Promise<T> {
  const body = (await response.json().catch(() => ({}))) as { error?: string; field?: string };
  if (!response.ok) throw new ApiError(body.error ?? `Request failed (${response.status})`, response.status, body.field);
  return body as T;
}

export async function fetchTemplates(params: URLSearchParams): Promise<TemplatePage> {
  return parse(await fetch(`/api/templates?${params}`, { headers: { accept: 'application/json' } }));
}

export async function createTemplate(body: unknown): Promise<TemplateView> {
  return parse(await fetch('/api/templates', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }));
}

export async function patchTemplate(id: number, body: unknown): Promise<TemplateView> {
  return parse(await fetch(`/api/templates/${id}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }));
}

export async function postCheck(id: number, body: { kind: 'grid'; json: unknown } | { kind: 'csv'; csv: string; units: string; tolerance: number; along: string }): Promise<unknown> {
  if (body.kind === 'grid') {
    return parse(await fetch(`/api/templates/${id}/checks`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body.json) }));
  }
  const query = new URLSearchParams({ units: body.units, tolerance: String(body.tolerance), along: body.along });
  return parse(await fetch(`/api/templates/${id}/checks?${query}`, { method: 'POST', headers: { 'content-type': 'text/csv' }, body: body.csv }));
}
