/**
 * The amount a builder types ("500", "1250.50", "1 250,50") read as integer minor units of a
 * currency, exactly: digits are counted, never multiplied as floats.
 */
import { minorDigits } from './money.ts';

export type AmountText = { ok: true; minor: number } | { ok: false; message: string };

export function minorFromText(text: string, currency: string): AmountText {
  const digits = minorDigits(currency);
  const cleaned = text.trim().replace(/[\s\u00a0']/g, '');
  const match = /^(\d+)(?:[.,](\d*))?$/.exec(cleaned);
  if (!match) return { ok: false, message: 'must be an amount such as 500 or 500.00' };
  const fraction = match[2] ?? '';
  if (fraction.length > digits) {
    return { ok: false, message: digits === 0 ? `${currency} has no minor units: type a whole amount` : `${currency} has ${digits} decimal places at most` };
  }
  const minor = Number(`${match[1]}${fraction.padEnd(digits, '0')}`);
  if (!Number.isSafeInteger(minor)) return { ok: false, message: 'is too large' };
  return { ok: true, minor };
}
