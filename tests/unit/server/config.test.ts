import { describe, expect, it } from 'vitest';
import { authConfig, LOCAL_SECRET } from '../../../server/config';

const strong = 'x'.repeat(40);
/** An environment as the process would see it (expo's global types make NODE_ENV required). */
const env = (e: Record<string, string>) => e as NodeJS.ProcessEnv;

describe('authConfig: AUTH_SECRET and PUBLIC_URL outside local development', () => {
  it('lets a loopback development server use the built-in secret', () => {
    expect(authConfig(env({ NODE_ENV: 'development' }), '127.0.0.1')).toMatchObject({ secret: LOCAL_SECRET, local: true, publicUrl: undefined });
  });
  it('requires both in production, with a message naming them', () => {
    expect(() => authConfig(env({ NODE_ENV: 'production' }), '127.0.0.1')).toThrow(/AUTH_SECRET and PUBLIC_URL must be set/);
    expect(() => authConfig(env({ NODE_ENV: 'production', AUTH_SECRET: strong }), '127.0.0.1')).toThrow(/PUBLIC_URL must be set/);
    expect(authConfig(env({ NODE_ENV: 'production', AUTH_SECRET: strong, PUBLIC_URL: 'https://plans.example' }), '127.0.0.1')).toMatchObject({ secret: strong, local: false });
  });
  it('requires them when PUBLIC_URL is set or the server listens beyond loopback', () => {
    expect(() => authConfig(env({ PUBLIC_URL: 'https://plans.example' }), '127.0.0.1')).toThrow(/AUTH_SECRET must be set/);
    expect(() => authConfig(env({}), '0.0.0.0')).toThrow(/AUTH_SECRET and PUBLIC_URL/);
  });
  it('refuses a short secret or the built-in one', () => {
    expect(() => authConfig(env({ NODE_ENV: 'production', AUTH_SECRET: 'short', PUBLIC_URL: 'https://p.example' }), '127.0.0.1')).toThrow(/at least 32/);
    expect(() => authConfig(env({ NODE_ENV: 'production', AUTH_SECRET: LOCAL_SECRET, PUBLIC_URL: 'https://p.example' }), '127.0.0.1')).toThrow(/not the built-in/);
  });
});
