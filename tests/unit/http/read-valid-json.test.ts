import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { readValidJson } from '~/lib/http/body.server.ts';

const schema = z.object({ name: z.string().min(1), frets: z.number().int().min(1) });

function post(body: string, type = 'application/json'): Request {
  return new Request('http://127.0.0.1/api/x', { method: 'POST', headers: { 'content-type': type }, body });
}

describe('readValidJson: one path from request body to validated value', () => {
  it('returns the parsed value of a valid body', async () => {
    const result = await readValidJson(post('{"name":"Fan","frets":24}'), 1024, schema);
    expect(result).toEqual({ ok: true, value: { name: 'Fan', frets: 24 } });
  });

  it('answers 400 naming the failing field', async () => {
    const result = await readValidJson(post('{"name":"Fan","frets":0}'), 1024, schema);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.response.status).toBe(400);
      expect(((await result.response.json()) as { field: string }).field).toBe('frets');
    }
  });

  it('answers 400 for non-JSON, 415 for another type and 413 over the limit', async () => {
    const statuses = await Promise.all([
      readValidJson(post('{nope'), 1024, schema),
      readValidJson(post('{}', 'text/plain'), 1024, schema),
      readValidJson(post(JSON.stringify({ name: 'x'.repeat(2000), frets: 1 })), 1024, schema),
    ]);
    expect(statuses.map((r) => (r.ok ? 200 : r.response.status))).toEqual([400, 415, 413]);
  });
});
