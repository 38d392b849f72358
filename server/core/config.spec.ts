import { loadConfig } from './config';

const base = { NODE_ENV: 'test', DATABASE_URL: 'postgres://postgres@127.0.0.1:5432/keepstitch', SESSION_SECRET: 'config-spec-'.padEnd(40, 'c') };

describe('configuration: TRUST_PROXY and the sign-in limits', () => {
  it('trusts no proxy unless told, and reads the sign-in defaults', () => {
    const config = loadConfig(base);
    expect(config.trustProxy).toBe(false);
    expect(config).toMatchObject({ signInLimit: 10, signInAddressLimit: 10, signInWindowMs: 15 * 60 * 1000, signInDelayMs: 2000 });
  });

  it.each([
    ['true', true],
    ['false', false],
    ['1', 1],
    ['loopback', ['loopback']],
    ['loopback, 10.0.0.5, 10.0.0.0/8, fd00::/8', ['loopback', '10.0.0.5', '10.0.0.0/8', 'fd00::/8']],
  ])('reads TRUST_PROXY=%s as Express takes it', (value, expected) => {
    expect(loadConfig({ ...base, TRUST_PROXY: value }).trustProxy).toEqual(expected);
  });

  it.each(['yes', '10.0.0.0/33', 'proxy.example.test', '1.2.3', 'loopback,,'])('stops on TRUST_PROXY=%s with a message saying what it takes', (value) => {
    expect(() => loadConfig({ ...base, TRUST_PROXY: value })).toThrow(/trustProxy: TRUST_PROXY must be false, true, the number of proxies/);
  });

  it('stops on a sign-in setting that is not a number of the right kind, naming it', () => {
    expect(() => loadConfig({ ...base, SIGN_IN_ADDRESS_LIMIT: '0' })).toThrow(/SIGN_IN_ADDRESS_LIMIT must be a whole number/);
    expect(() => loadConfig({ ...base, SIGN_IN_DELAY_MS: '-5' })).toThrow(/SIGN_IN_DELAY_MS must be 0 or more/);
  });
});
