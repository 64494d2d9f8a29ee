/**
 * Where to go after signing in. Only a same-site relative path is followed, so a crafted
 * `?next=https://elsewhere` or `//elsewhere` link cannot send a person off the site.
 *
 * The rule, checked on what was sent and again on the normalised path: a single leading `/`
 * followed by a character that is neither `/` nor `\`. The second check matters because URL
 * normalisation turns `/.//elsewhere` into `//elsewhere`, which a browser reads as another host.
 */
const SAME_SITE_PATH = /^\/[^/\\]/;

export function safeNextPath(next: string | null | undefined, fallback: string): string {
  if (!next || !SAME_SITE_PATH.test(next)) return fallback;
  if (/[\u0000-\u001f\\]/.test(next)) return fallback;
  const base = 'http://kerfline.invalid';
  try {
    const url = new URL(next, base);
    if (url.origin !== base) return fallback;
    const path = url.pathname + url.search + url.hash;
    return SAME_SITE_PATH.test(path) ? path : fallback;
  } catch {
    return fallback;
  }
}
