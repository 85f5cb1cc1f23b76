import { z } from 'zod';
import { adminUpdateUserInputSchema, listUsersQuerySchema } from '@shared/schemas/auth';
import type { AppContext } from '../context';
import { UserEntity } from '../entities/user.entity';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { AppError } from '../lib/app-error';
import { validate } from '../middleware/validate';
import { presentAdminUser } from '../presenters/account.presenter';

const userIdParams = z.object({ userId: z.uuid() });

export function adminRoutes(ctx: AppContext): RouteSpec[] {
  const users = ctx.ds.getRepository(UserEntity);
  return [
    route(
      'get',
      '/admin/users',
      access.admin,
      validate(listUsersQuerySchema, 'query'),
      handle(async (_req, res) => {
        const q = res.locals.query as z.infer<typeof listUsersQuerySchema>;
        const qb = users.createQueryBuilder('u').orderBy('u.created_at', 'DESC').skip((q.page - 1) * q.pageSize).take(q.pageSize);
        if (q.q) qb.where('u.email ILIKE :q OR u.display_name ILIKE :q', { q: `%${q.q.replace(/[%_\\]/g, '\\$&')}%` });
        const [rows, total] = await qb.getManyAndCount();
        res.json({ data: rows.map(presentAdminUser), meta: { total, page: q.page, pageSize: q.pageSize } });
      }),
    ),
    route(
      'patch',
      '/admin/users/:userId',
      access.admin,
      validate(userIdParams, 'params'),
      validate(adminUpdateUserInputSchema),
      handle(async (req, res) => {
        const { userId } = res.locals.params as z.infer<typeof userIdParams>;
        const body = req.body as z.infer<typeof adminUpdateUserInputSchema>;
        if (userId === req.user!.id) throw AppError.validation('Admins cannot change their own role or disable themselves.').because('admin_self_change');
        const user = await users.findOneBy({ id: userId });
        if (!user) throw AppError.notFound('Account');
        const patch: Partial<UserEntity> = {};
        if (body.role) patch.role = body.role;
        if (body.disabled !== undefined) {
          patch.disabledAt = body.disabled ? new Date() : null;
          // Disabling signs the account out everywhere.
          if (body.disabled) patch.sessionsValidAfter = new Date();
        }
        await users.update(userId, patch);
        res.json({ data: presentAdminUser(await users.findOneByOrFail({ id: userId })) });
      }),
    ),
    route(
      'get',
      '/admin/health',
      access.admin,
      handle(async (_req, res) => {
        const started = process.hrtime.bigint();
        const [counts] = (await ctx.ds.query(
          `SELECT (SELECT count(*)::int FROM users) AS users, (SELECT count(*)::int FROM cohorts) AS cohorts,
                  (SELECT count(*)::int FROM session WHERE expire > now()) AS active_sessions,
                  (SELECT count(*)::int FROM migrations) AS migrations, version() AS version`,
        )) as [{ users: number; cohorts: number; active_sessions: number; migrations: number; version: string }];
        const dbMs = Number(process.hrtime.bigint() - started) / 1e6;
        const mem = process.memoryUsage();
        res.json({
          data: {
            database: { status: 'up', latencyMs: Math.round(dbMs * 10) / 10, version: counts.version.split(' on ')[0], migrationsApplied: counts.migrations },
            counts: { users: counts.users, cohorts: counts.cohorts, activeSessions: counts.active_sessions },
            process: { uptimeS: Math.round(process.uptime()), rssMb: Math.round(mem.rss / 1048576), heapUsedMb: Math.round(mem.heapUsed / 1048576), node: process.version },
            mail: { mode: ctx.outbox ? 'sink' : 'smtp' },
          },
        });
      }),
    ),
    route('get', '/admin/outbox', access.admin, (_req, res) => {
      if (!ctx.outbox) {
        res.json({ data: [], meta: { available: false, message: 'Mail goes to a real SMTP server here; there is no local outbox.' } });
        return;
      }
      res.json({ data: [...ctx.outbox.messages].reverse(), meta: { available: true } });
    }),
  ];
}
