import { describe, expect, test } from 'vitest';
import { ConfigError, loadConfig } from '../../server/platform/config';

const production = {
  NODE_ENV: 'production',
  SESSION_SECRET: 'a-long-random-session-secret-for-this-test',
  STRIPE_WEBHOOK_SECRET: 'whsec_set_for_this_test_only',
  STRIPE_SECRET_KEY: 'sk_live_set_for_this_test_only',
  STRIPE_API_HOST: 'payments.example.test',
  STRIPE_API_PORT: '443',
  STRIPE_API_PROTOCOL: 'https',
};

function refusal(env: Record<string, string | undefined>): string {
  try {
    loadConfig(env);
  } catch (err) {
    if (err instanceof ConfigError) return err.message;
    throw err;
  }
  return '';
}

describe('configuration in production', () => {
  test('starts with its own secrets and a real payments host', () => {
    expect(loadConfig(production).NODE_ENV).toBe('production');
  });

  test.each([
    ['SESSION_SECRET', { SESSION_SECRET: undefined }],
    ['STRIPE_WEBHOOK_SECRET', { STRIPE_WEBHOOK_SECRET: undefined }],
    ['STRIPE_SECRET_KEY', { STRIPE_SECRET_KEY: undefined }],
    ['STRIPE_API_HOST', { STRIPE_API_HOST: '127.0.0.1' }],
    ['STRIPE_API_HOST', { STRIPE_API_HOST: 'localhost' }],
    ['STRIPE_API_PROTOCOL', { STRIPE_API_PROTOCOL: 'http' }],
  ])('refuses to start naming %s', (name, change) => {
    expect(refusal({ ...production, ...change })).toMatch(new RegExp(`^  ${name}:`, 'm'));
  });

  test('names every problem at once', () => {
    const message = refusal({ NODE_ENV: 'production' });
    for (const name of ['SESSION_SECRET', 'STRIPE_WEBHOOK_SECRET', 'STRIPE_SECRET_KEY', 'STRIPE_API_HOST', 'STRIPE_API_PROTOCOL']) expect(message).toContain(`${name}:`);
  });

  test('development and tests keep their defaults', () => {
    expect(loadConfig({ NODE_ENV: 'development' }).STRIPE_API_HOST).toBe('127.0.0.1');
    expect(loadConfig({ NODE_ENV: 'test' }).checkResponses).toBe(true);
  });
});
