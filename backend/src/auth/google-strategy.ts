/**
 * Google sign-in with passport-google-oauth20. By default its URLs point at the local oauth2-mock-server;
 * GOOGLE_AUTH_URL / GOOGLE_TOKEN_URL / GOOGLE_USERINFO_URL switch to real Google.
 * A known Google id signs in; a known e-mail is linked; otherwise a new account without an organisation is made.
 */
import type passport from 'passport';
import { Strategy as GoogleStrategy, type Profile } from 'passport-google-oauth20';
import type { DataSource } from 'typeorm';
import type { Config } from '../config.js';
import { User } from '../entities/user.entity.js';
import { markAddressProven } from '../services/account.service.js';

export const GOOGLE_STRATEGY = 'google';

export function googleConfigured(config: Config): boolean {
  return !!(config.GOOGLE_AUTH_URL && config.GOOGLE_TOKEN_URL && config.GOOGLE_USERINFO_URL);
}

export async function userForGoogleProfile(ds: DataSource, profile: Pick<Profile, 'id' | 'displayName' | 'emails'>): Promise<User> {
  const repo = ds.getRepository(User);
  // Google verified the address it shares, so it counts as proven (from the first Google sign-in).
  const bySub = await repo.findOneBy({ googleSub: profile.id });
  if (bySub) {
    if (!bySub.emailProvenAt) await markAddressProven(ds, bySub);
    return bySub;
  }
  const email = profile.emails?.[0]?.value?.trim().toLowerCase();
  if (!email) throw new Error('Google did not share an e-mail address');
  const byEmail = await repo.findOneBy({ email });
  if (byEmail) {
    await repo.update({ id: byEmail.id }, { googleSub: profile.id });
    await markAddressProven(ds, byEmail);
    return { ...byEmail, googleSub: profile.id };
  }
  return repo.save({ email, name: profile.displayName || email, googleSub: profile.id, passwordHash: null, unitPreference: 'us', emailProvenAt: new Date() });
}

export function configureGoogle(instance: passport.PassportStatic, ds: DataSource, config: Config, callbackUrl: string): void {
  instance.use(
    GOOGLE_STRATEGY,
    new GoogleStrategy(
      {
        clientID: config.GOOGLE_CLIENT_ID,
        clientSecret: config.GOOGLE_CLIENT_SECRET,
        callbackURL: callbackUrl,
        authorizationURL: config.GOOGLE_AUTH_URL,
        tokenURL: config.GOOGLE_TOKEN_URL,
        userProfileURL: config.GOOGLE_USERINFO_URL,
        state: true,
      },
      (_accessToken, _refreshToken, profile, done) => {
        userForGoogleProfile(ds, profile).then(
          (user) => done(null, user),
          (err: Error) => done(err),
        );
      },
    ),
  );
}
