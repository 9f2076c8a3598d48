import { MembersScreen } from '@/features/teams';

export default MembersScreen;
