import { z } from 'zod';
import { emailSchema } from './auth';

export const roles = ['owner', 'reviewer', 'viewer'] as const;
export const roleSchema = z.enum(roles, { error: 'must be owner, reviewer or viewer' });
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = { owner: 'Owner', reviewer: 'Reviewer', viewer: 'Viewer' };

/**
 * What each role may do in its team. Services check these on every request; the client reads the
 * same table only to hide buttons. Anyone outside the team gets a 404 for its resources.
 */
const capabilities = {
  'team.read': ['owner', 'reviewer', 'viewer'],
  'team.manage': ['owner'],
  'members.read': ['owner', 'reviewer', 'viewer'],
  'members.manage': ['owner'],
  'invitations.manage': ['owner'],
  'designs.read': ['owner', 'reviewer', 'viewer'],
  'designs.edit': ['owner'],
  'designs.comment': ['owner', 'reviewer'],
  'designs.review': ['owner', 'reviewer'],
  /** Clone out of this team; the target team must be one where the user is owner. */
  'designs.clone': ['owner', 'reviewer', 'viewer'],
  'share.manage': ['owner'],
  /** The team's library of measured curves: owners add and remove, every member reads and copies into designs. */
  'curves.read': ['owner', 'reviewer', 'viewer'],
  'curves.manage': ['owner'],
} as const satisfies Record<string, readonly Role[]>;
export type Capability = keyof typeof capabilities;

export function can(role: Role | null | undefined, capability: Capability): boolean {
  return role != null && (capabilities[capability] as readonly Role[]).includes(role);
}

export const teamNameSchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(80, { error: 'must be at most 80 characters' });

export const teamSchema = z.object({
  id: z.string(),
  name: z.string(),
  personal: z.boolean(),
  /** The caller's role in this team. */
  role: roleSchema,
  memberCount: z.number().int().nonnegative(),
  createdAt: z.iso.datetime(),
});
export type Team = z.infer<typeof teamSchema>;

export const teamListResponseSchema = z.object({ teams: z.array(teamSchema) });
export const teamResponseSchema = z.object({ team: teamSchema });

export const createTeamRequestSchema = z.object({ name: teamNameSchema });
export type CreateTeamRequest = z.input<typeof createTeamRequestSchema>;
export const renameTeamRequestSchema = createTeamRequestSchema;

export const teamParamsSchema = z.object({ teamId: z.string().min(1).max(64) });
export const memberParamsSchema = teamParamsSchema.extend({ userId: z.string().min(1).max(64) });
export const invitationParamsSchema = teamParamsSchema.extend({ invitationId: z.string().min(1).max(64) });

export const memberSchema = z.object({
  userId: z.string(),
  displayName: z.string(),
  email: z.string(),
  role: roleSchema,
  joinedAt: z.iso.datetime(),
});
export type Member = z.infer<typeof memberSchema>;
export const memberListResponseSchema = z.object({ members: z.array(memberSchema) });
export const memberResponseSchema = z.object({ member: memberSchema });

export const changeRoleRequestSchema = z.object({ role: roleSchema });
export type ChangeRoleRequest = z.input<typeof changeRoleRequestSchema>;

export const inviteRequestSchema = z.object({ email: emailSchema, role: roleSchema });
export type InviteRequest = z.input<typeof inviteRequestSchema>;

export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string().nullable(),
  createdAt: z.iso.datetime(),
  expiresAt: z.iso.datetime(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationListResponseSchema = z.object({ invitations: z.array(invitationSchema) });
export const invitationResponseSchema = z.object({ invitation: invitationSchema });

export const invitationTokenParamsSchema = z.object({ token: z.string().min(16).max(128) });

/** What the holder of an invitation link sees before accepting it. */
export const invitationPreviewSchema = z.object({
  teamName: z.string(),
  role: roleSchema,
  email: z.string(),
  invitedBy: z.string().nullable(),
  expiresAt: z.iso.datetime(),
  /** Whether to offer "sign in" or "create an account" first. Only the link's holder learns it. */
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const acceptInvitationResponseSchema = z.object({ team: teamSchema });
