import { randomInt } from 'node:crypto';
import { JOIN_CODE_ALPHABET, type CohortMember, type CohortSummary, type CreateCohortInput, type Invitation, type InvitationPreview, type MembershipRole, type UpdateCohortInput } from '@shared/schemas/cohorts';
import type { EntityManager } from 'typeorm';
import { hashToken, randomToken } from '../auth/tokens';
import type { AppContext } from '../context';
import { CohortInvitationEntity } from '../entities/cohort-invitation.entity';
import { CohortMembershipEntity } from '../entities/cohort-membership.entity';
import { CohortEntity } from '../entities/cohort.entity';
import type { UserEntity } from '../entities/user.entity';
import { AppError } from '../lib/app-error';
import { mailTemplates } from '../mail/templates';

const INVITE_TTL_MS = 14 * 24 * 3600 * 1000;

export function newJoinCode(): string {
  let s = '';
  for (let i = 0; i < 8; i++) s += JOIN_CODE_ALPHABET[randomInt(JOIN_CODE_ALPHABET.length)];
  return s;
}

/** A pseudonym like "Grower K7": never derived from the person, unique within the cohort. */
function newPseudonym(role: MembershipRole): string {
  const letters = 'ABCDEFGHJKMNPQRSTUVWXYZ';
  const tag = `${letters[randomInt(letters.length)]}${randomInt(2, 100)}`;
  return `${role === 'observer' ? 'Observer' : 'Grower'} ${tag}`;
}

interface SummaryRow {
  id: string;
  name: string;
  description: string;
  kind: CohortSummary['kind'];
  licence: string;
  capacity: number | null;
  closed_at: Date | null;
  created_at: Date;
  join_code: string;
  lead_id: string;
  member_count: number;
  my_role: MembershipRole | null;
  my_pseudonym: string | null;
}

function presentSummary(r: SummaryRow, userId: string): CohortSummary {
  const isLead = r.lead_id === userId;
  return {
    id: r.id,
    name: r.name,
    description: r.description,
    kind: r.kind,
    licence: r.licence,
    capacity: r.capacity,
    closed: r.closed_at !== null,
    memberCount: r.member_count,
    myRole: isLead ? 'lead' : (r.my_role ?? 'observer'),
    myPseudonym: r.my_pseudonym,
    joinCode: isLead ? r.join_code : null,
    createdAt: r.created_at.toISOString(),
  };
}

const summarySql = `
  SELECT c.id, c.name, c.description, c.kind, c.licence, c.capacity, c.closed_at, c.created_at, c.join_code, c.lead_id,
         (SELECT count(*)::int FROM cohort_memberships x WHERE x.cohort_id = c.id) AS member_count,
         m.role AS my_role, m.pseudonym AS my_pseudonym
    FROM cohorts c
    LEFT JOIN cohort_memberships m ON m.cohort_id = c.id AND m.user_id = $1`;

export function cohortsService(ctx: AppContext) {
  const cohorts = ctx.ds.getRepository(CohortEntity);

  async function addMember(tx: EntityManager, cohortId: string, userId: string, role: MembershipRole) {
    // Lock the cohort row: capacity and the closed flag are checked against a stable count.
    const [cohort] = (await tx.query(`SELECT id, lead_id, capacity, closed_at FROM cohorts WHERE id = $1 FOR UPDATE`, [cohortId])) as {
      id: string;
      lead_id: string;
      capacity: number | null;
      closed_at: Date | null;
    }[];
    if (!cohort) throw AppError.notFound('Cohort');
    if (cohort.closed_at) throw new AppError('conflict', 'This cohort is closed to new members. Ask its lead to reopen it.').because('cohort_closed');
    if (cohort.lead_id === userId) throw new AppError('conflict', 'You lead this cohort already.').because('cohort_already_lead');
    const existing = await tx.getRepository(CohortMembershipEntity).findOneBy({ cohortId, userId });
    if (existing) throw new AppError('conflict', 'You are already a member of this cohort.').because('cohort_already_member');
    const [{ n }] = (await tx.query(`SELECT count(*)::int AS n FROM cohort_memberships WHERE cohort_id = $1`, [cohortId])) as [{ n: number }];
    if (cohort.capacity !== null && n >= cohort.capacity) throw new AppError('conflict', 'This cohort is full. Ask its lead to raise the member limit.').because('cohort_full');
    for (let attempt = 0; attempt < 20; attempt++) {
      const pseudonym = newPseudonym(role);
      const clash = await tx.getRepository(CohortMembershipEntity).existsBy({ cohortId, pseudonym });
      if (clash) continue;
      await tx.getRepository(CohortMembershipEntity).insert({ cohortId, userId, role, pseudonym });
      return;
    }
    throw new Error('Could not find a free pseudonym.');
  }

  return {
    async create(lead: UserEntity, input: CreateCohortInput): Promise<CohortSummary> {
      for (let attempt = 0; attempt < 5; attempt++) {
        try {
          const { identifiers } = await cohorts.insert({ ...input, leadId: lead.id, joinCode: newJoinCode() });
          return this.get(identifiers[0]!.id as string, lead.id);
        } catch (err) {
          if ((err as { code?: string }).code !== '23505') throw err;
        }
      }
      throw new Error('Could not allocate a unique join code.');
    },

    async listFor(userId: string): Promise<CohortSummary[]> {
      const rows = (await ctx.ds.query(`${summarySql} WHERE c.lead_id = $1 OR m.id IS NOT NULL ORDER BY c.created_at DESC`, [userId])) as SummaryRow[];
      return rows.map((r) => presentSummary(r, userId));
    },

    async get(cohortId: string, userId: string): Promise<CohortSummary> {
      const rows = (await ctx.ds.query(`${summarySql} WHERE c.id = $2`, [userId, cohortId])) as SummaryRow[];
      if (!rows[0]) throw AppError.notFound('Cohort');
      return presentSummary(rows[0], userId);
    },

    async update(cohortId: string, userId: string, input: UpdateCohortInput): Promise<CohortSummary> {
      const { closed, ...rest } = input;
      const patch: Partial<CohortEntity> = { ...rest };
      if (closed !== undefined) patch.closedAt = closed ? ctx.now() : null;
      if (Object.keys(patch).length) await cohorts.update(cohortId, patch);
      return this.get(cohortId, userId);
    },

    async rotateJoinCode(cohortId: string, userId: string): Promise<CohortSummary> {
      for (let attempt = 0; attempt < 5; attempt++) {
        try {
          await cohorts.update(cohortId, { joinCode: newJoinCode() });
          return this.get(cohortId, userId);
        } catch (err) {
          if ((err as { code?: string }).code !== '23505') throw err;
        }
      }
      throw new Error('Could not allocate a unique join code.');
    },

    async joinByCode(user: UserEntity, code: string, role: MembershipRole): Promise<CohortSummary> {
      const cohort = await cohorts.findOneBy({ joinCode: code });
      // Same message for a mistyped code and a rotated one: the code itself is the secret.
      if (!cohort) throw AppError.validation('No cohort uses that join code. Check it with your lead; codes can be changed.', [{ path: 'code', message: 'No cohort uses that join code.', reason: 'join_code_unknown' }]).because('join_code_unknown');
      await ctx.ds.transaction((tx) => addMember(tx, cohort.id, user.id, role));
      return this.get(cohort.id, user.id);
    },

    async invite(cohortId: string, inviter: UserEntity, email: string, role: MembershipRole): Promise<Invitation> {
      const cohort = await cohorts.findOneByOrFail({ id: cohortId });
      if (cohort.closedAt) throw new AppError('conflict', 'This cohort is closed: reopen it before inviting anyone.').because('invite_cohort_closed');
      const [{ n }] = (await ctx.ds.query(`SELECT count(*)::int AS n FROM cohort_memberships WHERE cohort_id = $1`, [cohortId])) as [{ n: number }];
      if (cohort.capacity !== null && n >= cohort.capacity) throw new AppError('conflict', 'This cohort is full: raise the member limit before inviting anyone.').because('invite_cohort_full');
      const token = randomToken();
      const inv = await ctx.ds.getRepository(CohortInvitationEntity).save({
        cohortId,
        email,
        role,
        tokenHash: hashToken(token),
        expiresAt: new Date(ctx.now().getTime() + INVITE_TTL_MS),
        invitedById: inviter.id,
      });
      const href = `${ctx.publicUrl}/join?invite=${encodeURIComponent(token)}`;
      const [invitee] = (await ctx.ds.query(`SELECT language FROM users WHERE email = $1`, [email])) as { language: 'en' | 'es' }[];
      await ctx.mailer.send({ to: email, ...mailTemplates.cohortInvitation(invitee?.language ?? inviter.language, cohort.name, role, href, inv.expiresAt) });
      return { id: inv.id, email: inv.email, role: inv.role, expiresAt: inv.expiresAt.toISOString(), acceptedAt: null };
    },

    async listInvitations(cohortId: string): Promise<Invitation[]> {
      const rows = await ctx.ds.getRepository(CohortInvitationEntity).find({ where: { cohortId }, order: { createdAt: 'DESC' } });
      return rows.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString(), acceptedAt: i.acceptedAt?.toISOString() ?? null }));
    },

    async previewInvitation(token: string): Promise<InvitationPreview> {
      const rows = (await ctx.ds.query(
        `SELECT c.name, i.role, i.expires_at, i.accepted_at FROM cohort_invitations i JOIN cohorts c ON c.id = i.cohort_id WHERE i.token_hash = $1`,
        [hashToken(token)],
      )) as { name: string; role: MembershipRole; expires_at: Date; accepted_at: Date | null }[];
      const r = rows[0];
      if (!r) throw AppError.notFound('Invitation');
      return { cohortName: r.name, role: r.role, expired: r.expires_at <= ctx.now(), accepted: r.accepted_at !== null };
    },

    async acceptInvitation(user: UserEntity, token: string): Promise<CohortSummary> {
      const cohortId = await ctx.ds.transaction(async (tx) => {
        const rows = (await tx.query(`SELECT * FROM cohort_invitations WHERE token_hash = $1 FOR UPDATE`, [hashToken(token)])) as {
          id: string;
          cohort_id: string;
          email: string;
          role: MembershipRole;
          expires_at: Date;
          accepted_at: Date | null;
        }[];
        const inv = rows[0];
        if (!inv) throw AppError.notFound('Invitation');
        if (inv.accepted_at) throw new AppError('conflict', 'This invitation has already been used.').because('invitation_used');
        if (inv.expires_at <= ctx.now()) throw new AppError('conflict', 'This invitation has expired. Ask the cohort lead for a new one.').because('invitation_expired');
        if (inv.email !== user.email) throw AppError.forbidden(`This invitation was sent to ${inv.email}. Sign in with that address to accept it.`).because('invitation_other_email', { email: inv.email });
        await addMember(tx, inv.cohort_id, user.id, inv.role);
        await tx.query(`UPDATE cohort_invitations SET accepted_at = now() WHERE id = $1`, [inv.id]);
        return inv.cohort_id;
      });
      return this.get(cohortId, user.id);
    },

    async members(cohortId: string, userId: string): Promise<CohortMember[]> {
      const rows = (await ctx.ds.query(
        `SELECT id, pseudonym, role, created_at, user_id = $2 AS is_me FROM cohort_memberships WHERE cohort_id = $1 ORDER BY created_at`,
        [cohortId, userId],
      )) as { id: string; pseudonym: string; role: MembershipRole; created_at: Date; is_me: boolean }[];
      return rows.map((r) => ({ id: r.id, pseudonym: r.pseudonym, role: r.role, joinedAt: r.created_at.toISOString(), isMe: r.is_me }));
    },

    async removeMember(cohortId: string, membershipId: string): Promise<void> {
      const res = await ctx.ds.getRepository(CohortMembershipEntity).delete({ id: membershipId, cohortId });
      if (!res.affected) throw AppError.notFound('Member');
    },

    async leave(cohortId: string, userId: string): Promise<void> {
      const res = await ctx.ds.getRepository(CohortMembershipEntity).delete({ cohortId, userId });
      if (!res.affected) throw new AppError('conflict', 'You are not a member of this cohort (a lead cannot leave their own cohort).').because('cohort_not_member');
    },
  };
}
