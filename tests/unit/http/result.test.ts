import { describe, expect, it } from 'vitest';
import { failureAnswer, type Failure } from '~/lib/http/result.ts';

type Refusal = Failure<'not_found'> | Failure<'conflict', { current: number }>;

const ANSWERS = {
  not_found: () => new Response('gone', { status: 404 }),
  conflict: (failure: Refusal & { reason: 'conflict' }) => new Response(String(failure.current), { status: 409 }),
};

describe('failureAnswer', () => {
  it('answers each reason with its own answer, passing the failure on', async () => {
    const missing = failureAnswer<Refusal>({ ok: false, reason: 'not_found' }, ANSWERS);
    expect(missing.status).toBe(404);
    const stale = failureAnswer<Refusal>({ ok: false, reason: 'conflict', current: 7 }, ANSWERS);
    expect(stale.status).toBe(409);
    await expect(stale.text()).resolves.toBe('7');
  });
});
