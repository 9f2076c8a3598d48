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
});
