import { TeamsScreen } from '@/features/teams';

export default TeamsScreen;
