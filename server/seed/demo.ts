import { randomUUID } from 'node:crypto';
import type { DatabaseHandle } from '../../db/client';
import type { Role } from '../../shared/teams';
import { passwordHasher } from '../auth/password';
import { createAuthRepository } from '../auth/repository';
import type { Clock } from '../clock';
import { createTeamsRepository } from '../teams/repository';
import { demoNotebooks, seedDemoNotebooks } from './notebooks';
import { createSeedRepository } from './repository';
import { seedDemoReview } from './reviews';
import { newRecordId } from '../auth/index';

/** Invented people and an invented lab: any likeness to real ones is an accident. */
export const demoTeamName = 'Quillmere Optics Teaching Lab';
export const demoPassword = 'grating-demo-2026';
export const demoUsers = [
  { role: 'owner', displayName: 'Maren Okafor-Lind', email: 'maren.owner@quillmere-lab.example.com' },
  { role: 'reviewer', displayName: 'Tobiah Rennick', email: 'tobiah.reviewer@quillmere-lab.example.com' },
  { role: 'viewer', displayName: 'Juno Castellane', email: 'juno.viewer@quillmere-lab.example.com' },
] as const satisfies readonly { role: Role; displayName: string; email: string }[];

const seededKey = 'demo-seeded-at';

/**
 * Creates the demo lab team once, on a database that has no users yet, and returns the lines to
 * print; null when there is nothing to do. The caller never runs it in production.
 */
export async function seedDemoData({ database, clock }: { database: DatabaseHandle; clock: Clock }): Promise<string[] | null> {
  const meta = createSeedRepository(database.db);
  if ((await meta.getMeta(seededKey)) || (await meta.userCount()) > 0) return null;
  const auth = createAuthRepository(database.db);
  const teams = createTeamsRepository(database.db);
  const now = clock.now();
  const passwordHash = await passwordHasher.hash(demoPassword);
  const ids: string[] = [];
  for (const person of demoUsers) {
    const row = await auth.insertUserWithWorkspace(
      { id: newRecordId(), email: person.email, displayName: person.displayName, passwordHash, createdAt: now, emailVerifiedAt: now },
      { id: randomUUID(), name: `${person.displayName}’s workspace` },
    );
    if (!row) return null;
    ids.push(row.id);
  }
  const teamId = randomUUID();
  await teams.insertTeam({ id: teamId, name: demoTeamName, personal: false, createdAt: now }, ids[0]!);
  for (const [index, person] of demoUsers.entries()) {
    if (person.role !== 'owner') await teams.addMember(teamId, ids[index]!, person.role, now);
  }
  const notebooks = await seedDemoNotebooks(database, teamId, ids[0]!, now);
  const person = (index: number) => ({ id: ids[index]!, displayName: demoUsers[index]!.displayName });
  await seedDemoReview(database, notebooks[0]!, person(0), person(1));
  await meta.setMeta(seededKey, now.toISOString(), now);
  return [
    `Demo data: the team “${demoTeamName}” with three accounts (password: ${demoPassword})`,
    ...demoUsers.map((person) => `  ${person.role.padEnd(9)}${person.email}  (${person.displayName})`),
    `  notebooks: ${demoNotebooks.map((notebook) => `“${notebook.title}”`).join(', ')}`,
  ];
}
