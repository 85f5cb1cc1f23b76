import { z } from 'zod';
import { emailSchema } from './auth';

export const cohortKindSchema = z.enum(['programme', 'class', 'network']);
export const membershipRoleSchema = z.enum(['contributor', 'observer']);
export type MembershipRole = z.infer<typeof membershipRoleSchema>;

export const licenceSchema = z.enum(['CC-BY-4.0', 'CC-BY-SA-4.0', 'CC0-1.0', 'CC-BY-NC-4.0']);

export const createCohortInputSchema = z.object({
  name: z.string().trim().min(2, 'Give the cohort a name of at least 2 characters.').max(120),
  description: z.string().trim().max(2000).default(''),
  kind: cohortKindSchema.default('programme'),
  capacity: z.number().int().min(1).max(10000).nullable().default(null),
  licence: licenceSchema.default('CC-BY-4.0'),
});
export type CreateCohortInput = z.infer<typeof createCohortInputSchema>;

export const updateCohortInputSchema = z
  .object({
    name: z.string().trim().min(2).max(120),
    description: z.string().trim().max(2000),
    capacity: z.number().int().min(1).max(10000).nullable(),
    licence: licenceSchema,
    closed: z.boolean(),
  })
  .partial();
export type UpdateCohortInput = z.infer<typeof updateCohortInputSchema>;

/** Join codes are 8 characters from an alphabet without look-alikes (no 0/O, 1/I/L). */
export const JOIN_CODE_ALPHABET = '23456789ABCDEFGHJKMNPQRSTUVWXYZ';
export const joinCodeSchema = z
  .string()
  .trim()
  .toUpperCase()
  .transform((s) => s.replace(/[\s-]/g, ''))
  .pipe(z.string().regex(/^[2-9A-HJKMNP-Z]{8}$/, 'A join code has 8 letters and digits, like K7QM-4XPA.'));

export const joinCohortInputSchema = z.object({ code: joinCodeSchema, role: membershipRoleSchema.default('contributor') });
export type JoinCohortInput = z.infer<typeof joinCohortInputSchema>;

export const inviteInputSchema = z.object({ email: emailSchema, role: membershipRoleSchema.default('contributor') });
export type InviteInput = z.infer<typeof inviteInputSchema>;

export const cohortSummarySchema = z.object({
  id: z.uuid(),
  name: z.string(),
  description: z.string(),
  kind: cohortKindSchema,
  licence: z.string(),
  capacity: z.number().nullable(),
  closed: z.boolean(),
  memberCount: z.number(),
  /** The caller's relation to the cohort. */
  myRole: z.enum(['lead', 'contributor', 'observer']),
  myPseudonym: z.string().nullable(),
  /** Only for the lead. */
  joinCode: z.string().nullable(),
  createdAt: z.string(),
});
export type CohortSummary = z.infer<typeof cohortSummarySchema>;

export const cohortMemberSchema = z.object({
  id: z.uuid(),
  pseudonym: z.string(),
  role: membershipRoleSchema,
  joinedAt: z.string(),
  /** True for the caller's own row. */
  isMe: z.boolean(),
});
export type CohortMember = z.infer<typeof cohortMemberSchema>;

export const invitationSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  role: membershipRoleSchema,
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const invitationPreviewSchema = z.object({ cohortName: z.string(), role: membershipRoleSchema, expired: z.boolean(), accepted: z.boolean() });
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;
