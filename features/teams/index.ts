export { InvitationScreen } from './components/invitation-screen';
export { MembersScreen } from './components/members-screen';
export { TeamSwitcher } from './components/team-switcher';
export { TeamsScreen } from './components/teams-screen';
export { useTeamsQuery } from './queries';
