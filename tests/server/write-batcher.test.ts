import { describe, expect, it } from 'vitest';
import { createWriteBatcher } from '../../server/write-batcher';

type Item = { key: string; value: number };

/** A batcher whose writes record the batches they were given. */
function recording(fail: (items: Item[]) => boolean = () => false) {
  const batches: number[][] = [];
  const batcher = createWriteBatcher<Item, string>({
    run: async (items) => {
      batches.push(items.map((i) => i.value));
      await new Promise((resolve) => setTimeout(resolve, 5));
      if (fail(items)) throw new Error(`refused ${items.map((i) => i.value).join(',')}`);
      return items.map((i) => `wrote ${i.value}`);
    },
    keyOf: (item) => item.key,
    maxBatch: 3,
  });
  return { batches, batcher };
}

describe('the write batcher', () => {
  it('writes at once when idle and gathers what arrives meanwhile into the next batch', async () => {
    const { batches, batcher } = recording();
    const first = batcher.submit({ key: 'a', value: 1 });
    await new Promise((resolve) => setTimeout(resolve, 1));
    // These arrive while the first write runs.
    const rest = [2, 3].map((value) => batcher.submit({ key: `k${value}`, value }));
    expect(await Promise.all([first, ...rest])).toEqual(['wrote 1', 'wrote 2', 'wrote 3']);
    expect(batches).toEqual([[1], [2, 3]]);
  });

  it('never puts two items with one key in a batch, and keeps at most maxBatch together', async () => {
    const { batches, batcher } = recording();
    const items: Item[] = [
      { key: 'a', value: 1 },
      { key: 'a', value: 2 },
      { key: 'b', value: 3 },
      { key: 'c', value: 4 },
      { key: 'd', value: 5 },
    ];
    const results = await Promise.all(items.map((item) => batcher.submit(item)));
    expect(results).toEqual(items.map((i) => `wrote ${i.value}`));
    expect(batches).toEqual([
      [1, 3, 4],
      [2, 5],
    ]);
  });

  it('retries each item of a failed batch alone, so only the bad one fails', async () => {
    const { batches, batcher } = recording((items) => items.some((i) => i.value === 2));
    const outcomes = await Promise.allSettled([1, 2, 3].map((value) => batcher.submit({ key: `k${value}`, value })));
    expect(outcomes.map((o) => o.status)).toEqual(['fulfilled', 'rejected', 'fulfilled']);
    expect((outcomes[1] as PromiseRejectedResult).reason).toBeInstanceOf(Error);
    expect(batches).toEqual([[1, 2, 3], [1], [2], [3]]);
    // And it keeps working afterwards.
    expect(await batcher.submit({ key: 'k9', value: 9 })).toBe('wrote 9');
  });
});
