import type { apiContract } from '../../shared/contract/index';
import type { Implementation } from '../http/contract';
import { HttpError } from '../http/errors';
import { isLoopbackAddress, isLoopbackHost } from '../http/loopback';
import type { OutboxRepository } from '../mail/outbox-repository';

export const outboxLocalOnly = new HttpError(
  403,
  'outbox_local_only',
  'The outbox holds sign-in and password-reset links, so it answers only on the machine Blazebook runs on ' +
    '(open http://localhost:<port>/outbox there). To e-mail people on other machines, set SMTP_URL.',
);

/**
 * `GET /api/dev/outbox`: what the local fake mailer kept, so sign-up, reset and invitation links
 * can be followed without a mail server. Never mounted when NODE_ENV=production. Anyone who reads
 * it can reset anyone's password, so it answers only requests that arrive over loopback (the
 * socket's address) for a loopback host name (or PUBLIC_URL's, when that is configured).
 */
export function outboxRoute(
  outbox: OutboxRepository,
  options: { trustedOrigin?: string } = {},
): Implementation<typeof apiContract.platform.outbox> {
  const publicHostname = options.trustedOrigin ? new URL(options.trustedOrigin).hostname : null;
  return async (_input, req) => {
    if (!isLoopbackAddress(req.socket.remoteAddress) || !isLoopbackHost(req.get('host'), publicHostname)) {
      throw outboxLocalOnly;
    }
    return { messages: (await outbox.list()).map((m) => ({ ...m, createdAt: m.createdAt.toISOString() })) };
  };
}
