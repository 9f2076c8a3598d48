import type { Role } from '../../shared/teams';
import { createReadCache, type Writers } from '../read-cache';
import type { TeamsRepository } from './repository';

/**
 * Every team-scoped request asks for the caller's role; this answers repeats from memory. Roles
 * change only through the teams service, which forgets the ones it changes as soon as the change
 * is committed, so a member removed a moment ago gets a 404 on their next request. Outsiders'
 * misses are never kept, so someone who just joined is let in at once.
 */
export function createRoleDirectory(repository: Pick<TeamsRepository, 'roleOf'>, writers: Writers = 'alone') {
  const roles = createReadCache<Role>({ max: 20_000, writers });
  const key = (teamId: string, userId: string) => `${teamId} ${userId}`;
  return {
    roleOf(teamId: string, userId: string): Promise<Role | null> {
      return roles.load(key(teamId, userId), () => repository.roleOf(teamId, userId));
    },
    forget(teamId: string, userId: string) {
      roles.forget(key(teamId, userId));
    },
    forgetTeam(teamId: string) {
      roles.forgetWhere((k) => k.startsWith(`${teamId} `));
    },
  };
}

export type RoleDirectory = ReturnType<typeof createRoleDirectory>;
