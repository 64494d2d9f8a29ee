import { describe, expect, it } from 'vitest';
import { minorFromText } from '~/lib/payments/amount-text.ts';
import { formatMoney, isCurrencyCode, minorDigits, sumMinor } from '~/lib/payments/money.ts';
import { depositInputSchema, refundInputSchema } from '~/lib/schemas/deposit.ts';

describe('money in minor units', () => {
  // ISO 4217 minor-unit column: EUR and GBP 2, JPY 0, KWD and BHD 3.
  it('knows the minor digits of a currency (ISO 4217)', () => {
    expect([minorDigits('EUR'), minorDigits('GBP'), minorDigits('JPY'), minorDigits('KWD'), minorDigits('BHD')]).toEqual([2, 2, 0, 3, 3]);
  });

  it('formats integer minor units exactly, with Intl.NumberFormat', () => {
    expect(formatMoney({ minor: 125_000, currency: 'EUR' }, 'en-GB')).toBe('€1,250.00');
    expect(formatMoney({ minor: 5, currency: 'GBP' }, 'en-GB')).toBe('£0.05');
    expect(formatMoney({ minor: 30_000, currency: 'JPY' }, 'en-GB')).toBe('JP¥30,000');
    expect(formatMoney({ minor: 1_234, currency: 'KWD' }, 'en-GB')).toBe('KWD\u00a01.234');
    expect(formatMoney({ minor: 99_999_999, currency: 'USD' }, 'en-US')).toBe('$999,999.99');
    expect(formatMoney({ minor: 125_050, currency: 'EUR' }, 'de-DE')).toBe('1.250,50\u00a0€');
  });

  it('accepts only ISO 4217 codes the runtime knows', () => {
    expect(isCurrencyCode('EUR')).toBe(true);
    expect(isCurrencyCode('eur')).toBe(false);
    expect(isCurrencyCode('XYZ')).toBe(false);
    expect(isCurrencyCode('EURO')).toBe(false);
  });

  it('never adds two currencies', () => {
    expect(sumMinor([{ minor: 100, currency: 'EUR' }, { minor: 250, currency: 'EUR' }], 'EUR')).toBe(350);
    expect(() => sumMinor([{ minor: 100, currency: 'EUR' }, { minor: 1, currency: 'USD' }], 'EUR')).toThrow(/USD/);
  });
});

describe('deposit and refund input', () => {
  const fieldOf = (result: { success: boolean; error?: { issues: { path: (string | number)[] }[] } }) => result.error?.issues[0]?.path.join('.');

  it('takes whole positive minor units up to the maximum, and a currency code in any case', () => {
    const parsed = depositInputSchema.parse({ amountMinor: 50_000, currency: 'gbp', description: ' Deposit for the build ' });
    expect(parsed).toEqual({ amountMinor: 50_000, currency: 'GBP', description: 'Deposit for the build' });
    expect(depositInputSchema.parse({ amountMinor: 99_999_999 }).currency).toBeUndefined();
  });

  it('refuses zero, negative, fractional, too large and string amounts, naming the field', () => {
    for (const amountMinor of [0, -100, 12.5, 100_000_000, '5000']) {
      expect(fieldOf(depositInputSchema.safeParse({ amountMinor }))).toBe('amountMinor');
    }
    expect(fieldOf(depositInputSchema.safeParse({ amountMinor: 100, currency: 'EURO' }))).toBe('currency');
    expect(fieldOf(depositInputSchema.safeParse({ amountMinor: 100, description: 'x'.repeat(201) }))).toBe('description');
    expect(fieldOf(refundInputSchema.safeParse({ amountMinor: 0 }))).toBe('amountMinor');
    expect(refundInputSchema.parse({})).toEqual({});
  });
});

describe('an amount typed by the builder, read as minor units', () => {
  it('counts the digits exactly for the currency', () => {
    expect(minorFromText('500', 'EUR')).toEqual({ ok: true, minor: 50_000 });
    expect(minorFromText('1250.5', 'EUR')).toEqual({ ok: true, minor: 125_050 });
    expect(minorFromText('1 250,50', 'EUR')).toEqual({ ok: true, minor: 125_050 });
    // 0.29 * 100 is 28.999999999999996 as a float; the digit count gives 29.
    expect(minorFromText('0.29', 'USD')).toEqual({ ok: true, minor: 29 });
    expect(minorFromText('30000', 'JPY')).toEqual({ ok: true, minor: 30_000 });
    expect(minorFromText('1.234', 'KWD')).toEqual({ ok: true, minor: 1_234 });
  });

  it('refuses what is not an amount, or has more decimals than the currency', () => {
    expect(minorFromText('-5', 'EUR').ok).toBe(false);
    expect(minorFromText('5e3', 'EUR').ok).toBe(false);
    expect(minorFromText('1.005', 'EUR').ok).toBe(false);
    expect(minorFromText('10.5', 'JPY').ok).toBe(false);
  });
});
