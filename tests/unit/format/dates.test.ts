/** Dates in a shop's time zone, checked against the IANA tz database as Node's ICU ships it. */
import { describe, expect, it } from 'vitest';
import { dayInZone, isTimeZone, momentInZone, timeZones } from '~/lib/format/dates.ts';

// 2026-12-03T23:30Z is still the 3rd in London (GMT in winter) and already the 4th in Auckland
// (NZDT, UTC+13, from the tz database).
const LATE = new Date('2026-12-03T23:30:00Z');

describe('dates as people write them', () => {
  it('writes the day in the shop time zone', () => {
    expect(dayInZone(LATE, 'Europe/London')).toBe('3 December 2026');
    expect(dayInZone(LATE, 'Pacific/Auckland')).toBe('4 December 2026');
    expect(dayInZone(LATE, 'UTC')).toBe('3 December 2026');
  });

  it('writes a moment with the time and the zone named', () => {
    expect(momentInZone(LATE, 'Europe/London')).toBe('3 December 2026, 23:30 (Europe/London)');
    expect(momentInZone(LATE, 'Pacific/Auckland')).toBe('4 December 2026, 12:30 (Pacific/Auckland)');
  });

  it('knows the IANA zones and nothing else', () => {
    expect(timeZones()).toContain('UTC');
    expect(timeZones()).toContain('Europe/London');
    expect(isTimeZone('America/Vancouver')).toBe(true);
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isTimeZone('')).toBe(false);
  });
});
