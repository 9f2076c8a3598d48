import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { isLoopbackListenAddress } from '../../server/http/loopback';

describe('server configuration', () => {
  it('listens on loopback when HOST is not set, in development and in production', () => {
    expect(loadConfig({}).HOST).toBe('127.0.0.1');
    expect(loadConfig({ NODE_ENV: 'production' }).HOST).toBe('127.0.0.1');
  });

  it.each(['0.0.0.0', '::', '192.0.2.10', '127.0.0.1'] satisfies string[])(
    'keeps an explicit HOST=%s',
    (host) => {
      expect(loadConfig({ HOST: host }).HOST).toBe(host);
    },
  );

  it('refuses an empty HOST by name instead of listening on every interface', () => {
    expect(() => loadConfig({ HOST: '' })).toThrow(/HOST/);
  });

  it.each([
    ['127.0.0.1', true],
    ['127.1.2.3', true],
    ['::1', true],
    ['localhost', true],
    ['0.0.0.0', false],
    ['::', false],
    ['192.0.2.10', false],
    ['1270.0.0.1', false],
  ] satisfies [string, boolean][])('counts %s as loopback: %s', (host, loopback) => {
    expect(isLoopbackListenAddress(host)).toBe(loopback);
  });

  it('reads DATABASE_URL only as a postgres URL, and names it when it is not one', () => {
    expect(loadConfig({ DATABASE_URL: 'postgres://blazebook@127.0.0.1:5432/blazebook' }).DATABASE_URL).toBe(
      'postgres://blazebook@127.0.0.1:5432/blazebook',
    );
    expect(loadConfig({}).DATABASE_URL).toBeUndefined();
    expect(() => loadConfig({ DATABASE_URL: 'mysql://root@localhost/blazebook' })).toThrow(/DATABASE_URL/);
    expect(() => loadConfig({ DATABASE_POOL_SIZE: '0' })).toThrow(/DATABASE_POOL_SIZE/);
  });

  it('reads TRUST_PROXY as a hop count or as names and addresses, as Express takes them', () => {
    expect(loadConfig({ TRUST_PROXY: '1' }).TRUST_PROXY).toBe(1);
    expect(loadConfig({ TRUST_PROXY: 'loopback' }).TRUST_PROXY).toBe('loopback');
    expect(loadConfig({ TRUST_PROXY: '10.0.0.0/8, 192.0.2.1' }).TRUST_PROXY).toBe('10.0.0.0/8, 192.0.2.1');
    expect(loadConfig({}).TRUST_PROXY).toBeUndefined();
    expect(() => loadConfig({ TRUST_PROXY: 'a;b' })).toThrow(/TRUST_PROXY/);
  });
});
