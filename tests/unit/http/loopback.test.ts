import { describe, expect, it } from 'vitest';
import { isLoopbackAddress } from '~/lib/http/loopback.ts';

// RFC 1122 3.2.1.3 reserves 127.0.0.0/8 for loopback; RFC 4291 2.5.3 makes ::1 IPv6's loopback
// and 2.5.5.2 defines IPv4-mapped addresses (::ffff:a.b.c.d).
describe('isLoopbackAddress (who may see development-only pages)', () => {
  it.each(['127.0.0.1', '127.0.0.2', '127.255.255.254', '::1', '::ffff:127.0.0.1'])('%s is loopback', (address) => {
    expect(isLoopbackAddress(address)).toBe(true);
  });

  it.each(['10.0.0.1', '192.168.1.20', '203.0.113.5', '::ffff:203.0.113.5', '2001:db8::1', 'unknown', '', '127.0.0.1.evil', '127.0.0.256', ' 127.0.0.1'])(
    '%j is not',
    (address) => {
      expect(isLoopbackAddress(address)).toBe(false);
    },
  );
});
