import { afterEach, describe, expect, it, vi } from 'vitest';

const NAMES = ['PAYMENTS_SECRET_KEY', 'PAYMENTS_WEBHOOK_SECRET', 'PAYMENTS_API_URL'] as const;
const saved = Object.fromEntries(NAMES.map((n) => [n, process.env[n]]));

/** config() reads the environment once per module instance: a fresh one per case. */
async function freshConfig(env: Partial<Record<(typeof NAMES)[number], string>>) {
  for (const name of NAMES) delete process.env[name];
  Object.assign(process.env, env);
  vi.resetModules();
  const { config } = await import('~/lib/config/env.server.ts');
  return config;
}

afterEach(() => {
  for (const name of NAMES) {
    if (saved[name] === undefined) delete process.env[name];
    else process.env[name] = saved[name];
  }
});

describe('payment settings (docs/payments.md)', () => {
  it('are off without the secret key or without the webhook secret', async () => {
    expect((await freshConfig({}))().payments).toBeNull();
    expect((await freshConfig({ PAYMENTS_SECRET_KEY: 'sk_test_x' }))().payments).toBeNull();
    expect((await freshConfig({ PAYMENTS_WEBHOOK_SECRET: 'whsec_x' }))().payments).toBeNull();
  });

  it('point the SDK at the service by default, or at a local fake by host, port and protocol', async () => {
    const real = (await freshConfig({ PAYMENTS_SECRET_KEY: 'sk_test_x', PAYMENTS_WEBHOOK_SECRET: 'whsec_x' }))().payments;
    expect(real).toMatchObject({ apiHost: 'api.stripe.com', apiPort: 443, apiProtocol: 'https' });
    const fake = (await freshConfig({ PAYMENTS_SECRET_KEY: 'sk_test_x', PAYMENTS_WEBHOOK_SECRET: 'whsec_x', PAYMENTS_API_URL: 'http://127.0.0.1:12111' }))().payments;
    expect(fake).toMatchObject({ apiHost: '127.0.0.1', apiPort: 12111, apiProtocol: 'http' });
  });

  it('refuse plain http to another machine', async () => {
    const config = await freshConfig({ PAYMENTS_SECRET_KEY: 'sk_test_x', PAYMENTS_WEBHOOK_SECRET: 'whsec_x', PAYMENTS_API_URL: 'http://payments.example' });
    expect(() => config()).toThrow(/PAYMENTS_API_URL may use http:\/\/ only on this machine/);
  });
});
