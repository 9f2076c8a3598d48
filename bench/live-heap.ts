import WebSocket from 'ws';

/**
 * What a server process holds after a full garbage collection, read through its inspector (the
 * process started with `--inspect=127.0.0.1:0`, which prints the address it listens on). The RSS
 * says what the process took from the system, and an allocator rarely hands that back; the heap
 * after a collection says what is still reachable, which is what grows when something leaks.
 */
export type LiveHeap = {
  /** JavaScript objects still reachable after the collection. */
  heapUsedMb: number;
  /** Memory outside the JavaScript heap held by its objects: buffers and PGlite's WebAssembly memory. */
  externalMb: number;
  rssMb: number;
};

const MB = 1024 * 1024;

/** The inspector's WebSocket address from the server's output ("Debugger listening on ws://…"). */
export function inspectorUrl(output: string): string {
  const url = /Debugger listening on (ws:\/\/\S+)/.exec(output)?.[1];
  if (!url) throw new Error(`the server did not print an inspector address:\n${output.slice(0, 500)}`);
  return url;
}

export async function liveHeap(url: string): Promise<LiveHeap> {
  const socket = new WebSocket(url);
  await new Promise<void>((resolve, reject) => {
    socket.once('open', () => resolve());
    socket.once('error', reject);
  });
  let next = 0;
  const call = (method: string, params: Record<string, unknown> = {}) =>
    new Promise<Record<string, unknown>>((resolve, reject) => {
      const id = ++next;
      const onMessage = (data: WebSocket.RawData) => {
        const message = JSON.parse(String(data)) as { id?: number; result?: Record<string, unknown>; error?: { message: string } };
        if (message.id !== id) return;
        socket.off('message', onMessage);
        if (message.error) reject(new Error(`${method}: ${message.error.message}`));
        else resolve(message.result ?? {});
      };
      socket.on('message', onMessage);
      socket.send(JSON.stringify({ id, method, params }));
    });
  try {
    await call('HeapProfiler.collectGarbage');
    const answer = await call('Runtime.evaluate', { expression: 'JSON.stringify(process.memoryUsage())', returnByValue: true });
    const usage = JSON.parse((answer.result as { value: string }).value) as NodeJS.MemoryUsage;
    return { heapUsedMb: usage.heapUsed / MB, externalMb: usage.external / MB, rssMb: usage.rss / MB };
  } finally {
    socket.close();
  }
}
