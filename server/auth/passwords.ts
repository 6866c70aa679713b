import crypto from 'node:crypto';
import bcrypt from 'bcrypt';
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as zxcvbnCommon from '@zxcvbn-ts/language-common';
import * as zxcvbnEn from '@zxcvbn-ts/language-en';
import { LIMITS } from '../../shared/schemas/common';
import { errors } from '../errors';

let zxcvbn: ZxcvbnFactory | undefined;
const checker = () =>
  (zxcvbn ??= new ZxcvbnFactory({
    graphs: zxcvbnCommon.adjacencyGraphs,
    dictionary: { ...zxcvbnCommon.dictionary, ...zxcvbnEn.dictionary },
    translations: zxcvbnEn.translations,
  }));

/**
 * bcrypt reads only the first 72 bytes, so every password is first reduced to a fixed-length
 * digest (SHA-256, base64: 44 ASCII bytes, no NULs); long passphrases then count in full.
 */
const preHash = (password: string) => crypto.createHash('sha256').update(password, 'utf8').digest('base64');

export async function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(preHash(password), cost);
}

export async function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(preHash(password), hash);
}

let dummy: Promise<string> | undefined;
/** Compared against when the address is unknown, so both answers take about as long. */
export function dummyHash(cost: number): Promise<string> {
  return (dummy ??= bcrypt.hash(preHash(crypto.randomBytes(16).toString('hex')), cost));
}

/** Refuses short, overlong, common or guessable passwords with a message naming the field. */
export function assertStrongPassword(password: string, userInputs: string[], field = 'password'): void {
  if (password.length < LIMITS.passwordMin) {
    throw errors.badRequest('WEAK_PASSWORD', `Password must be at least ${LIMITS.passwordMin} characters.`, field);
  }
  if (password.length > LIMITS.passwordMax) {
    throw errors.badRequest('WEAK_PASSWORD', `Password must be at most ${LIMITS.passwordMax} characters.`, field);
  }
  const lower = password.toLowerCase();
  for (const input of userInputs) {
    const local = input.includes('@') ? input.split('@')[0].toLowerCase() : '';
    if (local.length >= 4 && lower.includes(local)) {
      throw errors.badRequest('WEAK_PASSWORD', 'Password must not contain your e-mail address.', field);
    }
  }
  const inputs = userInputs.flatMap((s) => [s, ...s.split(/[@.\s_-]+/)]).filter((s) => s.length >= 3);
  const result = checker().check(password.slice(0, 100), inputs);
  if (result.score < 3) {
    const hint = result.feedback.warning || result.feedback.suggestions[0] || 'Use a longer passphrase of unrelated words.';
    throw errors.badRequest('WEAK_PASSWORD', `Password is too easy to guess. ${hint}`.trim(), field);
  }
}

/** A random token for a link, and the hash we keep. */
export function newToken(): { token: string; hash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export const hashToken = (token: string) => crypto.createHash('sha256').update(token, 'utf8').digest('hex');
