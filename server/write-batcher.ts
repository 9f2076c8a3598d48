/**
 * Group commit for the embedded database, which has one writer: writes that arrive while one is
 * running wait, and then go together as one batch (one statement, one commit) instead of queueing
 * one by one. An idle server runs a write at once, so nothing waits for a batch to fill.
 *
 * Two items with the same key (say, saves on one design) never share a batch: the later one runs
 * in the next batch and sees what the earlier one wrote. If a batch fails, each of its items is
 * retried alone, so one bad item fails by itself.
 */
/** Event-loop turns a batch waits for more items to arrive, at most. */
const maxWaitTurns = 4;

export function createWriteBatcher<I, O>({
  run,
  keyOf,
  maxBatch,
}: {
  /** Writes the items in one go and answers one result per item, in order. */
  run: (items: I[]) => Promise<O[]>;
  keyOf: (item: I) => string;
  maxBatch: number;
}) {
  type Waiting = { item: I; resolve: (value: O) => void; reject: (error: unknown) => void };
  let queue: Waiting[] = [];
  let running = false;

  /** The next batch: the oldest items first, at most one per key. */
  function takeBatch(): Waiting[] {
    const keys = new Set<string>();
    const batch: Waiting[] = [];
    const rest: Waiting[] = [];
    for (const waiting of queue) {
      const key = keyOf(waiting.item);
      if (batch.length < maxBatch && !keys.has(key)) {
        keys.add(key);
        batch.push(waiting);
      } else rest.push(waiting);
    }
    queue = rest;
    return batch;
  }

  async function runAlone(waiting: Waiting) {
    try {
      const [result] = await run([waiting.item]);
      waiting.resolve(result as O);
    } catch (error) {
      waiting.reject(error);
    }
  }

  async function drain() {
    running = true;
    while (queue.length > 0) {
      // PGlite runs a statement on this thread, so requests that came in meanwhile are still
      // unread: let the event loop hand them over (up to their `submit`) before taking a batch,
      // for as long as more keep arriving (a few turns at most).
      for (let turn = 0; turn < maxWaitTurns && queue.length < maxBatch; turn++) {
        const before = queue.length;
        await new Promise((resolve) => setImmediate(resolve));
        if (queue.length === before) break;
      }
      const batch = takeBatch();
      try {
        const results = await run(batch.map((w) => w.item));
        if (results.length !== batch.length) throw new Error(`a batch of ${batch.length} answered ${results.length} results`);
        batch.forEach((w, i) => w.resolve(results[i] as O));
      } catch (error) {
        if (batch.length === 1) batch[0]!.reject(error);
        else for (const waiting of batch) await runAlone(waiting);
      }
    }
    running = false;
  }

  return {
    submit(item: I): Promise<O> {
      return new Promise<O>((resolve, reject) => {
        queue.push({ item, resolve, reject });
        if (!running) void drain();
      });
    },
  };
}
