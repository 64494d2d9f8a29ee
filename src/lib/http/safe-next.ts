/**
 * Where to go after signing in. Only a same-site relative path is followed, so a crafted
 * `?next=https://elsewhere` or `//elsewhere` link cannot send a person off the site.
 */
export function safeNextPath(next: string | null | undefined, fallback: string): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (/[\u0000-\u001f\\]/.test(next)) return fallback;
  const base = 'http://kerfline.invalid';
  try {
    const url = new URL(next, base);
    if (url.origin !== base) return fallback;
    return url.pathname + url.search + url.hash;
  } catch {
    return fallback;
  }
}
