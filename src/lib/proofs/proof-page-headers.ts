/**
 * Headers of every page that shows a proof: never indexed, no Referer (the URL carries the link
 * token) and never kept by shared caches.
 */
export const PROOF_PAGE_HEADERS: Readonly<Record<string, string>> = {
  'x-robots-tag': 'noindex, nofollow',
  'referrer-policy': 'no-referrer',
  'cache-control': 'private, no-store',
};

export function setProofPageHeaders(headers: Headers): void {
  for (const [name, value] of Object.entries(PROOF_PAGE_HEADERS)) headers.set(name, value);
}
