/** JSON calls to the built server as a signed-in test user (with this site's Origin, as a browser sends). */
import { expect } from 'vitest';
import { BASE_URL } from './browser.ts';
import type { TestUser } from './sessions.ts';

export function signedInApi(user: () => TestUser) {
  return async function api<T>(path: string, method = 'GET', body?: unknown): Promise<T> {
    const response = await fetch(`${BASE_URL}${path}`, {
      method,
      headers: { cookie: user().cookie, origin: BASE_URL, 'content-type': 'application/json' },
      body: body === undefined ? null : JSON.stringify(body),
    });
    expect(response.ok, `${method} ${path} answered ${response.status}`).toBe(true);
    return (await response.json()) as T;
  };
}
