import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { User } from '../entities/user.entity.js';
import { verifyPassword } from './password.js';

/** One answer for unknown e-mail and wrong password. */
export const BAD_CREDENTIALS = 'E-mail or password is not right';

export function configurePassport(dataSource: DataSource): passport.PassportStatic {
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await dataSource
          .getRepository(User)
          .createQueryBuilder('u')
          .addSelect('u.passwordHash')
          .where('u.email = :email', { email: email.trim().toLowerCase() })
          .getOne();
        const ok = await verifyPassword(user?.passwordHash, password);
        done(null, ok && user ? user : false, ok ? undefined : { message: BAD_CREDENTIALS });
      } catch (err) {
        done(err);
      }
    }),
  );
  instance.serializeUser((user, done) => done(null, (user as User).id));
  instance.deserializeUser((id: string, done) => done(null, { id }));
  return instance;
}
