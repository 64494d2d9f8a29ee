/**
 * The one step a page takes after its form's Astro Action ran (src/actions): done is a 303 to the
 * page's "done" notice (or where the action says), so a reload does not post again; a refusal sets
 * the page's status (and Retry-After) and is given back for the page to show beside its fields; an
 * action that failed outright (401, 403, 415, 500) is answered as it is.
 */
import type { AstroGlobal } from 'astro';
import type { FormOutcome } from './form-outcome.ts';

/** What `Astro.getActionResult(action)` gives for a form action (undefined when it was not posted). */
export type PostedForm = { data: FormOutcome; error: undefined } | { data: undefined; error: { message: string; status: number } } | undefined;
type Refusal = Extract<FormOutcome, { ok: false }>;

export type FormResult<N extends string> =
  | { response: Response; name?: undefined; refusal?: undefined }
  | { response?: undefined; name: N; refusal: Refusal }
  | { response?: undefined; name?: undefined; refusal?: undefined };

const UNKNOWN_FORM = 'Unknown form: post one of the forms on this page';

export function formResult<N extends string>(page: AstroGlobal, forms: Record<N, PostedForm>): FormResult<N> {
  for (const name of Object.keys(forms) as N[]) {
    const result = forms[name];
    if (!result) continue;
    if (result.error) return { response: plainText(result.error.message, result.error.status) };
    const outcome = result.data;
    if (outcome.ok) return { response: page.redirect(outcome.next ?? `${page.url.pathname}?done=${name}`, 303) };
    if (outcome.blank) return { response: new Response(null, { status: outcome.status }) };
    page.response.status = outcome.status;
    if (outcome.retryAfterSeconds !== undefined) page.response.headers.set('retry-after', String(outcome.retryAfterSeconds));
    return { name, refusal: outcome };
  }
  return page.request.method === 'POST' ? { response: plainText(UNKNOWN_FORM, 400) } : {};
}

function plainText(message: string, status: number): Response {
  return new Response(message, { status, headers: { 'content-type': 'text/plain; charset=utf-8' } });
}
