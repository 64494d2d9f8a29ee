/**
 * Form fields from a request body: an HTML form post (urlencoded or multipart) or a JSON object,
 * so the same page handler serves browsers without JavaScript and scripted clients alike.
 * The size limit and the media type are checked before anything is parsed.
 */
import { FORM_MAX_BYTES } from './action-body.ts';
import { readBytes, type BodyResult } from './body.server.ts';
import { problem } from './problem.ts';

const FORM_TYPES = ['application/x-www-form-urlencoded', 'multipart/form-data', 'application/json'] as const;

export async function readFormFields(request: Request, maxBytes = FORM_MAX_BYTES): Promise<BodyResult<Record<string, unknown>>> {
  const bytes = await readBytes(request, { maxBytes, types: FORM_TYPES });
  if (!bytes.ok) return bytes;
  const type = request.headers.get('content-type') ?? '';
  try {
    if (type.toLowerCase().startsWith('application/json')) {
      const value: unknown = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes.value));
      if (!value || typeof value !== 'object' || Array.isArray(value)) {
        return { ok: false, response: problem(400, 'Body must be a JSON object of fields', { field: '(body)' }) };
      }
      return { ok: true, value: value as Record<string, unknown> };
    }
    const form = await new Response(new Uint8Array(bytes.value), { headers: { 'content-type': type } }).formData();
    const fields: Record<string, unknown> = {};
    for (const [name, value] of form) if (typeof value === 'string') fields[name] = value;
    return { ok: true, value: fields };
  } catch {
    return { ok: false, response: problem(400, 'The form could not be read', { field: '(body)' }) };
  }
}
