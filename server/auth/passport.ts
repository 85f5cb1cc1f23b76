import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { dummyVerify, verifyPassword } from './passwords';
import { takeUserReadWithSession, type SessionUserJoin } from './session';

/** What the session remembers about the signed-in user. */
interface SessionUser {
  id: string;
  /** When this session signed in (ms); sessions older than the user's sessionsValidAfter are void. */
  at: number;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserEntity {}
  }
}

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;

/**
 * How the session store reads the users row with the session row (SessionWithUserStore): every
 * column of UserEntity, aliased `user.<property>`, turned back into the same entity TypeORM's
 * `findOneBy` gives (the driver's own hydration per column).
 */
export function sessionUserJoin(dataSource: DataSource): SessionUserJoin & { hydrate: (row: Record<string, unknown>) => UserEntity } {
  const meta = dataSource.getMetadata(UserEntity);
  const alias = (propertyPath: string) => `user.${propertyPath}`;
  return {
    usersTable: meta.schema ? `${quoteIdent(meta.schema)}.${quoteIdent(meta.tableName)}` : quoteIdent(meta.tableName),
    select: meta.columns.map((c) => `u.${quoteIdent(c.databaseName)} AS ${quoteIdent(alias(c.propertyPath))}`).join(', '),
    hydrate: (row) => {
      const user = meta.create(undefined, { fromDeserializer: true }) as UserEntity;
      for (const c of meta.columns) {
        const value = row[alias(c.propertyPath)];
        if (value !== undefined) c.setEntityValue(user, dataSource.driver.prepareHydratedValue(value, c));
      }
      return user;
    },
  };
}

export function configurePassport(dataSource: DataSource) {
  const userJoin = sessionUserJoin(dataSource);
  const users = dataSource.getRepository(UserEntity);
  const instance = new passport.Passport();

  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      users
        .findOneBy({ email: email.trim().toLowerCase() })
        .then(async (user) => {
          if (!user) {
            await dummyVerify(password);
            return done(null, false, { message: 'bad_credentials' });
          }
          const ok = await verifyPassword(user.passwordHash, password);
          if (!ok) return done(null, false, { message: 'bad_credentials' });
          if (user.disabledAt) return done(null, false, { message: 'disabled' });
          return done(null, user);
        })
        .catch(done);
    }),
  );

  instance.serializeUser((user, done) => {
    const value: SessionUser = { id: (user as UserEntity).id, at: Date.now() };
    done(null, value);
  });

  instance.deserializeUser((value: SessionUser, done) => {
    // The session store usually read the row already, with the session (one round trip); if not, look it up.
    const read = takeUserReadWithSession(value);
    const found = read === undefined ? users.findOneBy({ id: value.id }) : Promise.resolve(read && userJoin.hydrate(read));
    found
      .then((user) => {
        // Disabled accounts and sessions from before a password change are signed out.
        if (!user || user.disabledAt || user.sessionsValidAfter.getTime() > value.at) return done(null, false);
        done(null, user);
      })
      .catch(done);
  });

  return instance;
}
