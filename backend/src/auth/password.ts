import argon2 from 'argon2';

export const hashPassword = (password: string) => argon2.hash(password, { type: argon2.argon2id });

// A real hash of a random string, so an unknown e-mail costs the same time as a wrong password.
const dummyHash = argon2.hash(`no-such-user-${Math.random()}`, { type: argon2.argon2id });

export async function verifyPassword(hash: string | null | undefined, password: string): Promise<boolean> {
  try {
    if (!hash) {
      await argon2.verify(await dummyHash, password);
      return false;
    }
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}
