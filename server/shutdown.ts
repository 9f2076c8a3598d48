import type { Server, ServerResponse } from 'node:http';

export type ShutdownOptions = {
  /** Runs once the last connection has closed: closes the database. */
  close: () => Promise<void>;
  /** After this long, connections still open are cut and the shutdown counts as forced. */
  backstopMs?: number;
};

export type Shutdown = {
  /**
   * Stops accepting connections, lets requests in flight finish, closes every connection as soon
   * as it is idle, then runs `close`. Resolves 'drained' when every request got its answer, or
   * 'forced' when the backstop cut some. Calling it again returns the same promise.
   */
  stop(): Promise<'drained' | 'forced'>;
  readonly stopping: boolean;
};

/**
 * Graceful stop for an HTTP server. `server.close()` alone only closes the connections idle at
 * that moment: a keep-alive connection whose request was still running stays open after its
 * answer until the client's next request or the 5 s keep-alive timeout, so a busy server used to
 * run into the backstop. Here every answer given while stopping carries `Connection: close`, and
 * any connection that becomes idle is closed at once.
 */
export function gracefulShutdown(server: Server, { close, backstopMs = 10_000 }: ShutdownOptions): Shutdown {
  const inFlight = new Set<ServerResponse>();
  let stopping = false;
  let forced = false;
  let result: Promise<'drained' | 'forced'> | undefined;

  function refuseKeepAlive(res: ServerResponse) {
    if (!res.headersSent) res.setHeader('Connection', 'close');
  }

  // Prepended so it runs before Express, which may answer synchronously.
  server.prependListener('request', (_req, res: ServerResponse) => {
    if (stopping) refuseKeepAlive(res);
    inFlight.add(res);
    res.once('close', () => {
      inFlight.delete(res);
      // For answers whose headers left before the stop, so they could not say `Connection: close`.
      if (stopping) setImmediate(() => server.closeIdleConnections());
    });
  });

  function force() {
    forced = true;
    server.closeAllConnections();
  }

  function stop() {
    result ??= new Promise<'drained' | 'forced'>((resolve, reject) => {
      stopping = true;
      for (const res of inFlight) refuseKeepAlive(res);
      const backstop = setTimeout(force, backstopMs);
      // Also closes the connections idle right now (Node ≥ 19).
      server.close(() => {
        clearTimeout(backstop);
        close().then(() => resolve(forced ? 'forced' : 'drained'), reject);
      });
    });
    return result;
  }

  return {
    stop,
    get stopping() {
      return stopping;
    },
  };
}
