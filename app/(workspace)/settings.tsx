import { MailSettingsScreen } from '@/features/inbox';

export default MailSettingsScreen;
