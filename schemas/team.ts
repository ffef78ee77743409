import { z } from 'zod';
import { emailSchema, newPasswordSchema } from './auth';
import { roleSchema } from './roles';

export const memberSchema = z.object({
  userId: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  joinedAt: z.number(),
});
export type Member = z.infer<typeof memberSchema>;

export const inviteSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string(),
  createdAt: z.number(),
  expiresAt: z.number(),
});
export type Invite = z.infer<typeof inviteSchema>;

export const teamOverviewSchema = z.object({
  members: z.array(memberSchema),
  /** Pending invites; only the owner sees them. */
  invites: z.array(inviteSchema).optional(),
});
export type TeamOverview = z.infer<typeof teamOverviewSchema>;

export const createInviteSchema = z.object({
  email: emailSchema,
  role: roleSchema,
});
export type CreateInviteInput = z.infer<typeof createInviteSchema>;

export const changeRoleSchema = z.object({ role: roleSchema });

/** What the invite link shows before it is accepted. */
export const invitePreviewSchema = z.object({
  teamName: z.string(),
  role: roleSchema,
  email: z.string(),
  invitedBy: z.string(),
  /** The invited address already has a Treadle account: accepting asks for its password. */
  hasAccount: z.boolean(),
});
export type InvitePreview = z.infer<typeof invitePreviewSchema>;

export const acceptInviteSchema = z.object({
  name: z.string().trim().max(80, 'Use at most 80 characters.').optional(),
  password: z.string({ error: 'Enter a password.' }).min(1, 'Enter a password.'),
});
export type AcceptInviteInput = z.infer<typeof acceptInviteSchema>;

/** A new account made through an invite must meet the same password rules as sign-up. */
export const acceptInviteNewAccountSchema = z.object({
  name: z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(80, 'Use at most 80 characters.'),
  password: newPasswordSchema,
});

export const auditEntrySchema = z.object({
  id: z.number().int(),
  at: z.number(),
  actor: z.string(),
  action: z.string(),
  subject: z.string(),
  detail: z.string(),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;
