import { exampleDesign, type Design } from '../../../shared/design';
import type { Role } from '../../../shared/teams';
import { createTeamsRepository } from '../../../server/teams/repository';
import { createTestApp, signUp, type TestApp } from '../../support/test-app';

type Agent = Awaited<ReturnType<typeof signUp>>['agent'];
export type Person = { agent: Agent; user: { id: string; email: string; displayName: string } };

/**
 * A lab team with an owner, a reviewer and a viewer, plus someone outside it. Members are added
 * straight through the teams repository: invitations have their own tests.
 */
export async function createNotebookFixture(options: Parameters<typeof createTestApp>[0] = {}) {
  const ctx: TestApp = await createTestApp(options);
  const owner = await signUp(ctx.app, 'Owner');
  const reviewer = await signUp(ctx.app, 'Reviewer');
  const viewer = await signUp(ctx.app, 'Viewer');
  const outsider = await signUp(ctx.app, 'Outsider');
  const made = await owner.agent.post('/api/teams').send({ name: 'Spectroscopy lab' }).expect(201);
  const teamId: string = made.body.team.id;
  const teams = createTeamsRepository(ctx.database.db);
  const addMember = (team: string, person: Person, role: Role) =>
    teams.addMember(team, person.user.id, role, ctx.clock.now());
  await addMember(teamId, reviewer, 'reviewer');
  await addMember(teamId, viewer, 'viewer');
  return { ctx, teamId, owner, reviewer, viewer, outsider, addMember };
}

export type NotebookFixture = Awaited<ReturnType<typeof createNotebookFixture>>;

/** The example design with some fields replaced, one section deep. */
export function designWith(changes: { [K in keyof Design]?: Partial<NonNullable<Design[K]>> }): Design {
  const next = structuredClone(exampleDesign) as Record<string, unknown>;
  for (const [section, fields] of Object.entries(changes)) {
    next[section] = { ...(next[section] as object), ...fields };
  }
  return next as Design;
}

export async function createNotebook(
  fx: NotebookFixture,
  title = 'Visible scanner',
  params: Design = exampleDesign,
  tags: string[] = [],
) {
  const res = await fx.owner.agent
    .post(`/api/teams/${fx.teamId}/designs`)
    .send({ title, tags, params, notes: '# Why\nStarting point.', message: 'First cut' })
    .expect(201);
  return res.body as { design: { id: string; latestVersion: number }; version: { number: number } };
}

export function saveVersion(
  fx: NotebookFixture,
  designId: string,
  baseVersion: number,
  params: Design,
  message = 'Change',
) {
  return fx.owner.agent
    .post(`/api/designs/${designId}/versions`)
    .send({ baseVersion, params, notes: `Notes for ${message}`, message });
}
