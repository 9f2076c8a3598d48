import {
  inboxQuerySchema,
  inboxResponseSchema,
  mailSettingsResponseSchema,
  mailSettingsSchema,
  markReadRequestSchema,
  unreadCountResponseSchema,
} from '../reviews';
import { route } from './route';

const tag = 'Inbox';

/** What waits for the signed-in person: review requests, mentions, threads and decisions; and their review e-mail settings. */
export const inbox = {
  list: route({
    tag,
    method: 'GET',
    path: '/inbox',
    summary: 'What waits for me, newest first, with the unread count',
    access: { kind: 'signed-in' },
    query: inboxQuerySchema,
    output: inboxResponseSchema,
  }),
  unreadCount: route({
    tag,
    method: 'GET',
    path: '/inbox/unread-count',
    summary: 'How many inbox items are unread (the header badge)',
    access: { kind: 'signed-in' },
    output: unreadCountResponseSchema,
  }),
  markRead: route({
    tag,
    method: 'POST',
    path: '/inbox/read',
    summary: 'Mark some inbox items, or all of them, read',
    access: { kind: 'signed-in' },
    body: markReadRequestSchema,
    output: unreadCountResponseSchema,
  }),
  mailSettings: route({
    tag,
    method: 'GET',
    path: '/account/mail-settings',
    summary: 'Which review e-mails I get',
    access: { kind: 'signed-in' },
    output: mailSettingsResponseSchema,
  }),
  updateMailSettings: route({
    tag,
    method: 'PUT',
    path: '/account/mail-settings',
    summary: 'Turn each kind of review e-mail on or off',
    access: { kind: 'signed-in' },
    body: mailSettingsSchema,
    output: mailSettingsResponseSchema,
  }),
};
