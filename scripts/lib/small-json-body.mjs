// @ts-check
/**
 * Small JSON bodies read in front of the adapter. Left alone, the adapter hands the request
 * stream to the Request as an async iterable, and the route then reads it back through a web
 * stream built over it, chunk by chunk: for a body of a few KiB that costs more than the rest of
 * a POST /api/layout (bench/README.md). A JSON body whose Content-Length declares at most
 * SMALL_JSON_MAX_BYTES is read here and given to the adapter as `req.body` (its documented way in
 * for a body that was read already), so the route gets a Request over the bytes themselves.
 *
 * Nothing about what the app sees changes: the same bytes (a body that is not valid UTF-8 is
 * handed on as the raw bytes, so the route still answers 400), the same headers, so every size
 * limit, 413 and 415 still happens in the route. Bodies without a Content-Length (chunked),
 * larger ones and other media types stream to the adapter as before. Node drains an unread body
 * anyway, so reading at most this much before the app runs exposes nothing new.
 */

/** The largest declared body read here: the largest design the API takes (DESIGN_JSON_MAX_BYTES). */
export const SMALL_JSON_MAX_BYTES = 64 * 1024;

// ignoreBOM keeps a leading byte order mark, so the text encodes back to exactly the same bytes.
const strictUtf8 = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });

/**
 * Whether `req` carries a JSON body small enough to read here (declared, 1 to SMALL_JSON_MAX_BYTES).
 * @param {import('node:http').IncomingMessage} req
 */
export function isSmallJsonBody(req) {
  if (req.method === 'GET' || req.method === 'HEAD' || req.headers['transfer-encoding'] !== undefined) return false;
  const declared = req.headers['content-length'];
  if (declared === undefined || !/^\d{1,6}$/.test(declared)) return false;
  const length = Number(declared);
  if (length === 0 || length > SMALL_JSON_MAX_BYTES) return false;
  const type = (req.headers['content-type'] ?? '').split(';')[0]?.trim().toLowerCase();
  return type === 'application/json';
}

/**
 * Reads the body of `req` (isSmallJsonBody) and then calls `next` with `req.body` set: the text when
 * it is valid UTF-8, otherwise an async iterable of the raw bytes. A request the client abandons
 * before its end is dropped.
 * @param {import('node:http').IncomingMessage & { body?: unknown }} req
 * @param {() => void} next
 */
export function readSmallJsonBody(req, next) {
  /** @type {Buffer[]} */
  const chunks = [];
  req.on('data', (chunk) => chunks.push(chunk));
  req.once('error', () => req.destroy());
  req.once('end', () => {
    const bytes = chunks.length === 1 ? chunks[0] : Buffer.concat(chunks);
    if (!bytes || bytes.byteLength === 0) {
      next();
      return;
    }
    let text;
    try {
      text = strictUtf8.decode(bytes);
    } catch {
      text = undefined;
    }
    // An object with no own string keys and an async iterator is taken by the adapter as a stream.
    req.body = text ?? { async *[Symbol.asyncIterator]() { yield bytes; } };
    next();
  });
}
