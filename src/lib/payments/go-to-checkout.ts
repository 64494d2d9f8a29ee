/**
 * The browser's half of "pay the deposit": ask the proof's checkout route for a pay page and go
 * there. The body is empty: the amount and currency are the server's, never the browser's.
 */
export type CheckoutStart = { ok: true; url: string } | { ok: false; message: string };

export async function startCheckout(checkoutUrl: string): Promise<CheckoutStart> {
  try {
    const response = await fetch(checkoutUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{}',
      // The proof page sends no Referer; the request still needs its Origin for the CSRF check.
      referrerPolicy: 'strict-origin',
      credentials: 'same-origin',
    });
    const data = (await response.json().catch(() => ({}))) as { url?: unknown; error?: unknown };
    if (response.ok && typeof data.url === 'string') return { ok: true, url: data.url };
    return { ok: false, message: typeof data.error === 'string' ? data.error : `The pay page could not be opened (${response.status})` };
  } catch {
    return { ok: false, message: 'The connection failed; try again.' };
  }
}
