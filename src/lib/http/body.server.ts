/**
 * Reads a request body with the size limit enforced before parsing: Content-Length is checked
 * first, then nothing past the limit is kept or parsed as the stream arrives.
 */
import type { z, ZodTypeAny } from 'zod';
import { invalid, problem, zodIssues, type Checked } from './problem.ts';

export type BodyResult<T> = Checked<T>;

export interface ReadBodyOptions {
  maxBytes: number;
  /** Accepted media types (without parameters), e.g. ['application/json']. */
  types: readonly string[];
}

function mediaType(request: Request): string {
  return (request.headers.get('content-type') ?? '').split(';')[0]!.trim().toLowerCase();
}

/**
 * An over-limit body that keeps streaming is read and dropped up to this many bytes, so the client
 * gets the 413 on a connection it can reuse; a longer one is cut off and the connection closed.
 */
const DISCARD_MAX_BYTES = 8 * 1024 * 1024;

function tooLarge(maxBytes: number, connection: 'keep-alive' | 'close'): Response {
  const headers: Record<string, string> = connection === 'close' ? { connection: 'close' } : {};
  return problem(413, `Request body is larger than ${Math.round(maxBytes / 1024)} KiB`, { field: '(body)' }, headers);
}

/** Drops the rest of the body; false when it was cut off at DISCARD_MAX_BYTES. */
async function discardRest(reader: ReadableStreamDefaultReader<Uint8Array>, readSoFar: number): Promise<boolean> {
  for (let total = readSoFar; ; ) {
    const { done, value } = await reader.read();
    if (done) return true;
    total += value.byteLength;
    if (total > DISCARD_MAX_BYTES) {
      await reader.cancel();
      return false;
    }
  }
}

/** The raw body as bytes, or a 413/415 response. */
export async function readBytes(request: Request, options: ReadBodyOptions): Promise<BodyResult<Uint8Array>> {
  const type = mediaType(request);
  if (!options.types.includes(type)) {
    return {
      ok: false,
      response: problem(415, `Content-Type must be ${options.types.join(' or ')}`, { field: 'content-type' }),
    };
  }
  const declared = Number(request.headers.get('content-length') ?? '0');
  // Unread, a declared body is drained by Node's HTTP server itself, keeping the connection.
  if (declared > options.maxBytes) return { ok: false, response: tooLarge(options.maxBytes, 'keep-alive') };
  const chunks: Uint8Array[] = [];
  let total = 0;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > options.maxBytes) {
        const drained = await discardRest(reader, total);
        return { ok: false, response: tooLarge(options.maxBytes, drained ? 'keep-alive' : 'close') };
      }
      chunks.push(value);
    }
  }
  const bytes = new Uint8Array(total);
  let offset = 0;
  for (const c of chunks) {
    bytes.set(c, offset);
    offset += c.byteLength;
  }
  return { ok: true, value: bytes };
}

/** The body as UTF-8 text (invalid UTF-8 is a 400). */
export async function readText(request: Request, options: ReadBodyOptions): Promise<BodyResult<string>> {
  const bytes = await readBytes(request, options);
  if (!bytes.ok) return bytes;
  try {
    return { ok: true, value: new TextDecoder('utf-8', { fatal: true }).decode(bytes.value) };
  } catch {
    return { ok: false, response: problem(400, 'Body is not valid UTF-8 text', { field: '(body)' }) };
  }
}

/** The body parsed as JSON (unknown: validate it with a zod schema next). */
export async function readJson(request: Request, maxBytes: number): Promise<BodyResult<unknown>> {
  const text = await readText(request, { maxBytes, types: ['application/json'] });
  if (!text.ok) return text;
  try {
    return { ok: true, value: JSON.parse(text.value) as unknown };
  } catch (e) {
    const why = e instanceof Error ? e.message : 'parse error';
    return { ok: false, response: problem(400, `Body is not valid JSON (${why})`, { field: '(body)' }) };
  }
}


/** The JSON body checked against `schema`: its parsed value, or the 4xx to send (400 names the field). */
export async function readValidJson<S extends ZodTypeAny>(request: Request, maxBytes: number, schema: S): Promise<BodyResult<z.infer<S>>> {
  const body = await readJson(request, maxBytes);
  if (!body.ok) return body;
  const parsed = schema.safeParse(body.value);
  if (!parsed.success) return { ok: false, response: invalid(zodIssues(parsed.error)) };
  return { ok: true, value: parsed.data as z.infer<S> };
}
