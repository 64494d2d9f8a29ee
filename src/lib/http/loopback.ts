/**
 * Whether a client address is this machine's own loopback (127.0.0.0/8, ::1, or 127.x written as
 * an IPv4-mapped IPv6 address). Development-only pages are served to such addresses alone.
 */
export function isLoopbackAddress(address: string): boolean {
  const v4 = address.startsWith('::ffff:') ? address.slice('::ffff:'.length) : address;
  if (/^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(v4)) return v4.split('.').every((part) => Number(part) <= 255);
  return address === '::1' || address === '0:0:0:0:0:0:0:1';
}
