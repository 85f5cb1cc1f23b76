import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { UserEntity } from '../entities/user.entity';
import { dummyVerify, verifyPassword } from './passwords';

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

export function configurePassport(dataSource: DataSource) {
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
    users
      .findOneBy({ id: value.id })
      .then((user) => {
        // Disabled accounts and sessions from before a password change are signed out.
        if (!user || user.disabledAt || user.sessionsValidAfter.getTime() > value.at) return done(null, false);
        done(null, user);
      })
      .catch(done);
  });

  return instance;
}
