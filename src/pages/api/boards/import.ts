import type { APIRoute } from 'astro';
import { readBoardFile } from '~/lib/boards/board-file.ts';
import { checkDesign } from '~/lib/boards/board-responses.server.ts';
import { CAN } from '~/lib/auth/index.server.ts';
import { requireRole } from '~/lib/http/require-role.ts';
import { createBoard, freeBoardName } from '~/lib/boards/boards.server.ts';
import { readBytes } from '~/lib/http/body.server.ts';
import { invalid, json, problem, type Checked } from '~/lib/http/problem.ts';
import { BOARD_FILE_MAX_BYTES } from '~/lib/schemas/board.ts';

export const prerender = false;

/** Room for the multipart boundaries and headers around a file of the full size. */
const MULTIPART_OVERHEAD = 8 * 1024;

/**
 * POST /api/boards/import: a board JSON file (as the body, application/json, or as the `file`
 * field of a multipart form), at most 256 KiB. Always creates a new board; never overwrites one,
 * and never takes the name of one the shop has (it appends " (2)", " (3)", …).
 */
export const POST: APIRoute = async ({ locals, request }) => {
  const guard = requireRole(locals.user, CAN.design);
  if (!guard.ok) return guard.response;
  const text = await fileText(request);
  if (!text.ok) return text.response;
  let parsed: unknown;
  try {
    parsed = JSON.parse(text.value);
  } catch (e) {
    const why = e instanceof Error ? e.message : 'parse error';
    return problem(400, `The file is not valid JSON (${why})`, { field: 'file' });
  }
  const file = readBoardFile(parsed);
  if (!file.ok) return invalid(file.issues);
  const design = checkDesign(file.file.design, file.designPrefix);
  if (!design.ok) return invalid(design.issues);
  // An imported board never takes the name of one the shop has: it becomes "name (2)" and so on.
  const name = await freeBoardName(guard.value.shopId, design.design.name);
  const created = await createBoard(guard.value, {
    design: { ...design.design, name },
    instrumentType: file.file.instrumentType,
    clientName: file.file.clientName,
    note: name === design.design.name ? 'Imported from a file' : `Imported from a file; renamed from “${design.design.name}”, a name the shop already had`,
  }, 'imported');
  return json(created, 201, { location: `/api/boards/${created.id}` });
};

async function fileText(request: Request): Promise<Checked<string>> {
  const multipart = (request.headers.get('content-type') ?? '').toLowerCase().startsWith('multipart/form-data');
  const limit = BOARD_FILE_MAX_BYTES + (multipart ? MULTIPART_OVERHEAD : 0);
  const bytes = await readBytes(request, { maxBytes: limit, types: ['application/json', 'multipart/form-data'] });
  if (!bytes.ok) return bytes;
  let data: Uint8Array = bytes.value;
  if (multipart) {
    const form = await new Response(new Uint8Array(bytes.value), { headers: { 'content-type': request.headers.get('content-type')! } })
      .formData()
      .catch(() => null);
    const file = form?.get('file');
    if (!file || typeof file === 'string') return { ok: false, response: problem(400, 'Choose a JSON file to import', { field: 'file' }) };
    if (file.size > BOARD_FILE_MAX_BYTES) return { ok: false, response: problem(413, 'The file is larger than 256 KiB', { field: 'file' }) };
    data = new Uint8Array(await file.arrayBuffer());
  }
  try {
    return { ok: true, value: new TextDecoder('utf-8', { fatal: true }).decode(data) };
  } catch {
    return { ok: false, response: problem(400, 'The file is not UTF-8 text', { field: 'file' }) };
  }
}
