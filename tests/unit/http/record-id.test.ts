import { describe, expect, it } from 'vitest';
import { parseRecordId } from '~/lib/http/record-id.ts';

describe('parseRecordId (the one id parser for URLs)', () => {
  it.each([
    ['1', 1],
    ['7', 7],
    ['2000000000', 2_000_000_000],
    ['9007199254740991', Number.MAX_SAFE_INTEGER],
  ])('%j is id %d', (raw, id) => {
    expect(parseRecordId(raw)).toBe(id);
  });

  it.each(['7e0', '07', ' 7', '7 ', '0x7', '7.0', '+7', '-7', '0', '', '9007199254740993', '99999999999999999', 'abc'])('%j is not an id', (raw) => {
    expect(parseRecordId(raw)).toBeNull();
  });

  it('null and undefined are not ids', () => {
    expect(parseRecordId(null)).toBeNull();
    expect(parseRecordId(undefined)).toBeNull();
  });
});
