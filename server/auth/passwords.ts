import argon2 from 'argon2';
import { AppError } from '../lib/app-error';
import { isCommonPassword } from './common-passwords';

/**
 * argon2id with the OWASP Password Storage Cheat Sheet's first recommended setting
 * (m = 19 MiB, t = 2, p = 1).
 */
const options = { type: argon2.argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, options);
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/** A hash to verify against when the account does not exist, so both paths take as long. */
let dummyHash: Promise<string> | null = null;
export function dummyVerify(password: string): Promise<boolean> {
  dummyHash ??= hashPassword('no-such-account-placeholder');
  return dummyHash.then((h) => verifyPassword(h, password)).then(() => false);
}

export function assertPasswordAcceptable(password: string, email?: string) {
  if (isCommonPassword(password) || (email && password.toLowerCase() === email.toLowerCase())) {
    throw AppError.validation('That password is too easy to guess.', [
      { path: 'password', message: 'That password is on the list of most common passwords. Choose another one.', reason: 'password_common' },
    ]).because('password_common');
  }
}
