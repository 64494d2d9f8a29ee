import { describe, expect, it } from 'vitest';
import { list, nested, parseFormBody, text } from '../../../scripts/payments/fake/form-body.ts';

describe('the fake payment service reads the SDK form encoding', () => {
  it('turns bracketed keys into nested objects and lists', () => {
    const body = new URLSearchParams({
      mode: 'payment',
      'line_items[0][quantity]': '1',
      'line_items[0][price_data][currency]': 'eur',
      'line_items[0][price_data][unit_amount]': '50000',
      'metadata[deposit_id]': '7',
    }).toString();
    const form = parseFormBody(body);
    expect(text(form.mode)).toBe('payment');
    const item = nested(list(form.line_items)[0]);
    expect(text(nested(item.price_data).unit_amount)).toBe('50000');
    expect(nested(form.metadata)).toEqual({ deposit_id: '7' });
  });
});
