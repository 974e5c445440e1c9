import { ConfigError, loadConfig } from '../../../server/config';

describe('loadConfig: accounts settings', () => {
  test('empty environment → bcrypt cost 12, 20 auth requests per 15 min, week-long sessions', () => {
    const c = loadConfig({});
    expect(c.BCRYPT_COST).toBe(12);
    expect(c.AUTH_RATE_LIMIT).toBe(20);
    expect(c.AUTH_RATE_WINDOW_MS).toBe(900_000);
    expect(c.SESSION_MAX_AGE_HOURS).toBe(168);
    expect(c.PUBLIC_ORIGIN).toBeUndefined();
  });

  test('NODE_ENV=test → bcrypt cost 10 (the floor), unless set', () => {
    expect(loadConfig({ NODE_ENV: 'test' }).BCRYPT_COST).toBe(10);
    expect(loadConfig({ NODE_ENV: 'test', BCRYPT_COST: '11' }).BCRYPT_COST).toBe(11);
  });

  test('BCRYPT_COST=8 → ConfigError naming BCRYPT_COST (cost ≥ 10 required)', () => {
    expect(() => loadConfig({ BCRYPT_COST: '8' })).toThrow(ConfigError);
    expect(() => loadConfig({ BCRYPT_COST: '8' })).toThrow(/BCRYPT_COST/);
  });

  test('PUBLIC_ORIGIN=not a url → ConfigError naming PUBLIC_ORIGIN', () => {
    expect(() => loadConfig({ PUBLIC_ORIGIN: 'rampart example' })).toThrow(/PUBLIC_ORIGIN/);
  });

  test('AUTH_RATE_LIMIT=0 → ConfigError naming AUTH_RATE_LIMIT', () => {
    expect(() => loadConfig({ AUTH_RATE_LIMIT: '0' })).toThrow(/AUTH_RATE_LIMIT/);
  });
});
