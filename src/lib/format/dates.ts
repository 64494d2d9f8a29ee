/**
 * Dates as people write them, in a shop's time zone (an IANA name such as "Europe/London"):
 * "3 December 2026" and "3 December 2026, 14:05 (Europe/London)". Used in e-mails and pages.
 */

/** The time zones a shop may choose: every IANA zone this runtime knows, and UTC. */
export function timeZones(): string[] {
  const zones = Intl.supportedValuesOf('timeZone');
  return zones.includes('UTC') ? zones : ['UTC', ...zones];
}

export function isTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone: name });
    return timeZones().includes(name);
  } catch {
    return false;
  }
}

/** "3 December 2026" in `timeZone`. */
export function dayInZone(date: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeZone }).format(date);
}

/** "3 December 2026, 14:05 (Europe/London)" in `timeZone`. */
export function momentInZone(date: Date, timeZone: string): string {
  const text = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeStyle: 'short', timeZone }).format(date);
  return `${text.replace(' at ', ', ')} (${timeZone})`;
}
