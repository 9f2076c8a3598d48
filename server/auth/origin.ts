import type { RequestHandler } from 'express';
import { forbidden } from '../http/errors';
import { isLoopbackHost } from '../http/loopback';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

export type OriginCheckOptions = {
  /** PUBLIC_URL's origin when configured: then only it is accepted (proxies may rewrite Host). */
  trustedOrigin?: string;
  /** `METHOD /api/path` pairs that change nothing and read no cookie (see DEVELOPERS.md). */
  exempt?: readonly string[];
};

function originOf(value: string): string | null {
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/**
 * CSRF defence: a state-changing request must say where it comes from, and that must be us.
 * Browsers send `Origin` on every cross-site and same-site POST/PUT/PATCH/DELETE; a missing one
 * is refused too. Without a configured origin the request's own host is the reference (a forged
 * request from another site carries our Host but the other site's Origin) — and that host must be
 * localhost, 127.0.0.1 or [::1]: a DNS-rebinding page sends its own name as both Origin and Host,
 * so matching the two alone would let it through. Any other name needs PUBLIC_URL.
 */
export function originCheck({ trustedOrigin, exempt = [] }: OriginCheckOptions): RequestHandler {
  const trusted = trustedOrigin ? originOf(trustedOrigin) : null;
  const exemptSet = new Set(exempt);
  return (req, _res, next) => {
    if (safeMethods.has(req.method) || exemptSet.has(`${req.method} ${req.baseUrl}${req.path}`)) {
      next();
      return;
    }
    const origin = req.get('origin');
    const actual = origin ? originOf(origin) : null;
    const sameHost = actual !== null && !trusted && new URL(actual).host === req.get('host');
    if (sameHost && !isLoopbackHost(req.get('host'))) {
      next(forbidden(`Blazebook is open here as ${req.get('host')}, not localhost: set PUBLIC_URL to this address so its pages may make changes.`.slice(0, 300)));
      return;
    }
    const ok = actual !== null && (trusted ? actual === trusted : sameHost);
    next(ok ? undefined : forbidden('This request did not come from Blazebook’s own pages.'));
  };
}
