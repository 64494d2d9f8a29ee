/**
 * Money as Kerfline keeps it: an integer count of the currency's minor units (cents, pence; yen
 * have none) and an ISO 4217 code. Never a float, never two currencies mixed in one sum. The
 * number of minor digits per currency comes from the runtime's Intl data (CLDR, which follows
 * ISO 4217's minor-unit column), so formatting and the count agree.
 */

export interface Money {
  /** Integer, in the currency's minor units. */
  minor: number;
  /** ISO 4217 alphabetic code, upper case ("EUR"). */
  currency: string;
}

/** Every ISO 4217 code this runtime can format (Intl.supportedValuesOf, ECMA-402). */
export function currencyCodes(): string[] {
  return Intl.supportedValuesOf('currency');
}

export function isCurrencyCode(code: string): boolean {
  return /^[A-Z]{3}$/.test(code) && currencyCodes().includes(code);
}

/** How many minor digits `currency` has: 2 for EUR, 0 for JPY, 3 for KWD. */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/**
 * "€1,250.00" (locale "en"), "1.250,00 €" (locale "de"): exact for any integer amount, since the
 * division by 10^digits is done by placing the decimal point in the digit string.
 */
export function formatMoney(money: Money, locale = 'en-GB'): string {
  const digits = minorDigits(money.currency);
  const sign = money.minor < 0 ? '-' : '';
  const whole = String(Math.abs(money.minor)).padStart(digits + 1, '0');
  const decimal = digits === 0 ? whole : `${whole.slice(0, -digits)}.${whole.slice(-digits)}`;
  const format = new Intl.NumberFormat(locale, { style: 'currency', currency: money.currency });
  // A decimal string keeps every digit (ECMA-402 formats string numbers exactly).
  return format.format(`${sign}${decimal}` as unknown as number);
}

/** Sums amounts of one currency; throws when they are not all of `currency`. */
export function sumMinor(amounts: readonly Money[], currency: string): number {
  let total = 0;
  for (const amount of amounts) {
    if (amount.currency !== currency) throw new Error(`cannot add ${amount.currency} to ${currency}`);
    total += amount.minor;
  }
  return total;
}
