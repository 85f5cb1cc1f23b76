import type { SignUpInput, UpdateAccountInput } from '@shared/schemas/auth';
import { IsNull } from 'typeorm';
import { assertPasswordAcceptable, hashPassword, verifyPassword } from '../auth/passwords';
import { hashToken, randomToken } from '../auth/tokens';
import type { AppContext } from '../context';
import { UserTokenEntity } from '../entities/user-token.entity';
import { UserEntity } from '../entities/user.entity';
import { AppError } from '../lib/app-error';
import { mailTemplates } from '../mail/templates';

const RESET_TTL_MS = 60 * 60 * 1000;
const VERIFY_TTL_MS = 7 * 24 * 60 * 60 * 1000;

export function authService(ctx: AppContext) {
  const users = ctx.ds.getRepository(UserEntity);
  const tokens = ctx.ds.getRepository(UserTokenEntity);

  async function issueToken(userId: string, purpose: UserTokenEntity['purpose'], ttlMs: number) {
    const token = randomToken();
    await tokens.insert({ userId, purpose, tokenHash: hashToken(token), expiresAt: new Date(ctx.now().getTime() + ttlMs) });
    return token;
  }

  /** Finds an unused, unexpired token and marks it used in the same statement (single use). */
  async function consumeToken(token: string, purpose: UserTokenEntity['purpose']) {
    const rows = (await ctx.ds.query(
      `UPDATE user_tokens SET used_at = now()
        WHERE token_hash = $1 AND purpose = $2 AND used_at IS NULL AND expires_at > $3
        RETURNING user_id`,
      [hashToken(token), purpose, ctx.now()],
    )) as [{ user_id: string }[], number];
    return rows[0][0]?.user_id ?? null;
  }

  async function sendVerification(user: UserEntity) {
    const token = await issueToken(user.id, 'email_verify', VERIFY_TTL_MS);
    const href = `${ctx.publicUrl}/verify-email?token=${encodeURIComponent(token)}`;
    await ctx.mailer.send({ to: user.email, ...mailTemplates.verifyEmail(user.language, user.displayName, href) });
  }

  return {
    async signUp(input: SignUpInput): Promise<UserEntity> {
      assertPasswordAcceptable(input.password, input.email);
      if (await users.existsBy({ email: input.email })) {
        throw new AppError('conflict', 'An account with this e-mail already exists. Sign in, or reset your password.', [
          { path: 'email', message: 'An account with this e-mail already exists.', reason: 'email_taken' },
        ]).because('email_taken');
      }
      const user = users.create({
        email: input.email,
        passwordHash: await hashPassword(input.password),
        displayName: input.displayName,
        role: input.role,
        language: input.language,
        unitSystem: input.unitSystem,
      });
      try {
        await users.insert(user);
      } catch (err) {
        if ((err as { code?: string }).code === '23505') throw new AppError('conflict', 'An account with this e-mail already exists.').because('email_taken');
        throw err;
      }
      const saved = await users.findOneByOrFail({ id: user.id });
      sendVerification(saved).catch((err) => ctx.logger.warn({ err }, 'verification e-mail failed'));
      return saved;
    },

    /** Always resolves the same way, whether or not the address has an account. */
    async requestPasswordReset(email: string): Promise<void> {
      const user = await users.findOneBy({ email, disabledAt: IsNull() });
      if (!user) return;
      const token = await issueToken(user.id, 'password_reset', RESET_TTL_MS);
      const href = `${ctx.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
      await ctx.mailer.send({ to: user.email, ...mailTemplates.passwordReset(user.language, user.displayName, href) });
    },

    async resetPassword(token: string, password: string): Promise<void> {
      await ctx.ds.transaction(async (tx) => {
        // Lock the token row so two uses of the same link cannot both succeed.
        const rows = (await tx.query(
          `SELECT id, user_id FROM user_tokens
            WHERE token_hash = $1 AND purpose = 'password_reset' AND used_at IS NULL AND expires_at > $2
            FOR UPDATE`,
          [hashToken(token), ctx.now()],
        )) as { id: string; user_id: string }[];
        const row = rows[0];
        if (!row) throw new AppError('validation_failed', 'This reset link has expired or was already used. Ask for a new one.').because('reset_link_invalid');
        const userRepo = tx.getRepository(UserEntity);
        const user = await userRepo.findOneByOrFail({ id: row.user_id });
        assertPasswordAcceptable(password, user.email);
        // A new password ends every existing session, and every other reset link for the account.
        await userRepo.update(user.id, { passwordHash: await hashPassword(password), sessionsValidAfter: new Date() });
        await tx.getRepository(UserTokenEntity).update({ userId: user.id, purpose: 'password_reset', usedAt: IsNull() }, { usedAt: new Date() });
      });
    },

    async verifyEmail(token: string): Promise<void> {
      const userId = await consumeToken(token, 'email_verify');
      if (!userId) throw new AppError('validation_failed', 'This confirmation link has expired or was already used.').because('confirm_link_invalid');
      await users.update({ id: userId, emailVerifiedAt: IsNull() }, { emailVerifiedAt: new Date() });
    },

    async resendVerification(user: UserEntity) {
      if (user.emailVerifiedAt) return;
      await sendVerification(user);
    },

    async changePassword(user: UserEntity, current: string, next: string): Promise<void> {
      if (!(await verifyPassword(user.passwordHash, current))) {
        throw AppError.validation('The current password is not right.', [{ path: 'currentPassword', message: 'The current password is not right.', reason: 'current_password_wrong' }]).because('current_password_wrong');
      }
      assertPasswordAcceptable(next, user.email);
      await users.update(user.id, { passwordHash: await hashPassword(next), sessionsValidAfter: new Date() });
    },

    async updateAccount(userId: string, input: UpdateAccountInput): Promise<UserEntity> {
      if (Object.keys(input).length) await users.update(userId, input);
      return users.findOneByOrFail({ id: userId });
    },
  };
}
