import type { apiContract } from '../../shared/contract/index';
import { requireUser } from '../auth/index';
import type { GroupImplementation } from '../http/contract';
import type { InboxService } from './service';

/** What waits for the signed-in person and their review e-mail settings (`apiContract.inbox`); only translates HTTP. */
export function inboxRouter(inbox: InboxService): GroupImplementation<typeof apiContract.inbox> {
  return {
    list: ({ query }, _req, res) => inbox.list(requireUser(res), query),
    unreadCount: (_input, _req, res) => inbox.unreadCount(requireUser(res)),
    markRead: ({ body }, _req, res) => inbox.markRead(requireUser(res), body),
    mailSettings: (_input, _req, res) => inbox.mailSettings(requireUser(res)),
    updateMailSettings: ({ body }, _req, res) => inbox.updateMailSettings(requireUser(res), body),
  };
}
