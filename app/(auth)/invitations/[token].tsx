import { InvitationScreen } from '@/features/teams';

export default InvitationScreen;
