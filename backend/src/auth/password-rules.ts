/** Password rules after OWASP ASVS 4.0 §2.1: at least 8 characters, long passphrases welcome, no common passwords. */
import { dictionary } from '@zxcvbn-ts/language-common';
import { badRequest } from '../http/app-error.js';

const COMMON = new Set((dictionary['passwords-common'] as string[]).map((p) => p.toLowerCase()));

export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 1024;

export function passwordProblem(password: string, context: { email?: string; name?: string } = {}): string | null {
  const length = [...password].length;
  if (length < PASSWORD_MIN) return `Use at least ${PASSWORD_MIN} characters`;
  if (length > PASSWORD_MAX) return `Use at most ${PASSWORD_MAX} characters`;
  const lower = password.toLowerCase();
  if (COMMON.has(lower)) return 'This password is among the most common ones; choose another';
  const local = context.email?.split('@')[0]?.toLowerCase();
  if (local && local.length >= 4 && lower === local) return 'Do not use your e-mail address as the password';
  if (new Set(lower).size === 1) return 'Choose a password that is not one repeated character';
  return null;
}

export function assertPasswordAcceptable(password: string, context: { email?: string; name?: string } = {}, field = 'password'): void {
  const problem = passwordProblem(password, context);
  if (problem) throw badRequest('Some fields need attention', { fieldErrors: [{ path: field, message: problem }] });
}
