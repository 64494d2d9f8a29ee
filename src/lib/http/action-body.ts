/**
 * The size check for form posts to Astro Actions (`?_action=` on a page, or `/_actions/…`), which
 * read their body whole: the same 16 KiB as every other form, known from Content-Length before a
 * byte is read (browsers always send it for a form), else 411.
 */
import { problem } from './problem.ts';

/** Forms here carry a few short fields; 16 KiB is generous. Every form post is held to it. */
export const FORM_MAX_BYTES = 16 * 1024;

export function isActionPost(request: Request, url: URL): boolean {
  return request.method === 'POST' && (url.searchParams.has('_action') || url.pathname.startsWith('/_actions/'));
}

/** The 411/413 answer for an action post whose body is not declared or is too large; null to go on. */
export function actionBodyRefusal(request: Request, url: URL): Response | null {
  if (!isActionPost(request, url)) return null;
  const declared = request.headers.get('content-length');
  if (declared === null || !/^[0-9]+$/.test(declared)) return problem(411, 'A form post must declare its Content-Length', { field: '(body)' });
  if (Number(declared) > FORM_MAX_BYTES) return problem(413, `Request body is larger than ${Math.round(FORM_MAX_BYTES / 1024)} KiB`, { field: '(body)' });
  return null;
}
