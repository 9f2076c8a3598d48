import { describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { persistedState } from '@/features/ui/persisted-state';
import { withFakeLocalStorage } from '../../support/fake-local-storage';

const pointSchema = z.object({ x: z.number(), y: z.number() });

const local = withFakeLocalStorage();

const stored = (key: string) => JSON.parse(local.items.get(key) ?? 'null') as unknown;

describe('persistedState', () => {
  it('keeps a value with its version and reads it back', () => {
    const points = persistedState({ version: 2, schema: pointSchema });
    expect(points.write('p.round-trip', { x: 1, y: 2 })).toBe(true);
    expect(stored('p.round-trip')).toEqual({ version: 2, value: { x: 1, y: 2 } });
    expect(points.read('p.round-trip')).toEqual({ x: 1, y: 2 });
  });

  it('reads null where nothing is kept', () => {
    expect(persistedState({ version: 1, schema: pointSchema }).read('p.nothing')).toBeNull();
  });

  it.each([
    { why: 'not JSON', raw: '{"version": 1, "value": ' },
    { why: 'no envelope', raw: '{"x": 1, "y": 2}' },
    { why: 'the wrong shape', raw: '{"version": 1, "value": {"x": "one"}}' },
  ])('drops a value that is $why instead of failing', ({ raw }) => {
    local.items.set('p.bad', raw);
    expect(persistedState({ version: 1, schema: pointSchema }).read('p.bad')).toBeNull();
    expect(local.items.has('p.bad')).toBe(false);
  });

  it('migrates a value an older version wrote and stores it in the current shape', () => {
    local.items.set('p.old', JSON.stringify({ version: 1, value: [3, 4] }));
    const points = persistedState({
      version: 2,
      schema: pointSchema,
      migrate: (old, from) => (from === 1 && Array.isArray(old) ? { x: old[0], y: old[1] } : undefined),
    });
    expect(points.read('p.old')).toEqual({ x: 3, y: 4 });
    expect(stored('p.old')).toEqual({ version: 2, value: { x: 3, y: 4 } });
  });

  it('drops an older version it has no migration for', () => {
    local.items.set('p.older', JSON.stringify({ version: 1, value: { x: 1, y: 2 } }));
    expect(persistedState({ version: 2, schema: pointSchema }).read('p.older')).toBeNull();
    expect(local.items.has('p.older')).toBe(false);
  });

  it('drops an older version whose migration gives up', () => {
    local.items.set('p.given-up', JSON.stringify({ version: 1, value: 'whatever' }));
    const points = persistedState({ version: 2, schema: pointSchema, migrate: () => undefined });
    expect(points.read('p.given-up')).toBeNull();
    expect(local.items.has('p.given-up')).toBe(false);
  });

  it('leaves alone what a newer release wrote, for that release to read', () => {
    const newer = JSON.stringify({ version: 3, value: { x: 1, y: 2, z: 3 } });
    local.items.set('p.newer', newer);
    expect(persistedState({ version: 2, schema: pointSchema }).read('p.newer')).toBeNull();
    expect(local.items.get('p.newer')).toBe(newer);
  });

  it('reads old, unversioned keys once, moves the value over and removes them', () => {
    local.items.set('legacy.x', '5');
    local.items.set('legacy.y', '6');
    const legacy = vi.fn((_key: string, readOld: (oldKey: string) => unknown) => {
      const x = readOld('legacy.x');
      if (x === undefined) return null;
      return { value: { x, y: readOld('legacy.y') }, keys: ['legacy.x', 'legacy.y'] };
    });
    const points = persistedState({ version: 1, schema: pointSchema, legacy });
    expect(points.read('p.moved')).toEqual({ x: 5, y: 6 });
    expect(local.items.has('legacy.x') || local.items.has('legacy.y')).toBe(false);
    expect(stored('p.moved')).toEqual({ version: 1, value: { x: 5, y: 6 } });
    expect(points.read('p.moved')).toEqual({ x: 5, y: 6 });
    expect(legacy).toHaveBeenCalledTimes(1);
  });

  it('removes old keys that hold nothing usable', () => {
    local.items.set('legacy.broken', 'not json');
    const points = persistedState({
      version: 1,
      schema: pointSchema,
      legacy: (_key, readOld) => ({ value: readOld('legacy.broken'), keys: ['legacy.broken'] }),
    });
    expect(points.read('p.broken')).toBeNull();
    expect(local.items.has('legacy.broken')).toBe(false);
  });

  it('keeps old keys while the new entry cannot be stored, so nothing is lost on reload', () => {
    local.items.set('legacy.full', '{"x": 7, "y": 8}');
    local.refuseWrites(true);
    const points = persistedState({
      version: 1,
      schema: pointSchema,
      legacy: (_key, readOld) => ({ value: readOld('legacy.full'), keys: ['legacy.full'] }),
    });
    expect(points.read('p.full')).toEqual({ x: 7, y: 8 });
    expect(local.items.has('legacy.full')).toBe(true);
    points.remove('p.full');
  });

  it('keeps a value the browser refuses in memory for this session and says so', () => {
    local.refuseWrites(true);
    const points = persistedState({ version: 1, schema: pointSchema });
    expect(points.write('p.memory', { x: 1, y: 1 })).toBe(false);
    expect(points.read('p.memory')).toEqual({ x: 1, y: 1 });
    points.remove('p.memory');
    expect(points.read('p.memory')).toBeNull();
  });

  it('works without local storage at all', () => {
    vi.stubGlobal('localStorage', undefined);
    const points = persistedState({ version: 1, schema: pointSchema });
    expect(points.write('p.none', { x: 2, y: 2 })).toBe(false);
    expect(points.read('p.none')).toEqual({ x: 2, y: 2 });
    points.remove('p.none');
  });
});
