export { InboxLink } from './components/inbox-link';
export { InboxScreen } from './components/inbox-screen';
export { MailSettingsScreen } from './components/mail-settings-screen';
export { inboxBadgeText, inboxItemPath, inboxItemSubject, inboxLinkName } from './links';
export { useUnreadCountQuery } from './queries';
