import { InboxScreen } from '@/features/inbox';

export default InboxScreen;
