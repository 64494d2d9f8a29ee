/** The client's IP address for rate limits; "unknown" when the adapter cannot tell. */
export function clientIp(context: { clientAddress: string }): string {
  try {
    return context.clientAddress || 'unknown';
  } catch {
    return 'unknown';
  }
}
