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

/** Our own name is the first thing anyone guessing a Lagline password tries. */
export const PRODUCT_WORDS = ['lagline'];

/**
 * zxcvbn scores 0–4; 4 means an estimated 10¹⁰ guesses or more, which at bcrypt cost 12 keeps an
 * offline attack on a stolen hash busy for a long time, where 3 (10⁸) falls in hours. There is no
 * length bonus for a 3: padding a weak password to 20 characters ("Password1234567890!!") scores 3,
 * while real passphrases of that length score 4 (zxcvbn adds a factor for every extra word), so length
 * alone is no evidence of strength.
 */
export const MIN_SCORE = 4;

const tokens = (s: string) => s.split(/[^\p{L}\p{N}]+/u);

/** The words an attacker aiming at this user would try first: the product, their name, e-mail and team. */
function personalWords(userInputs: string[]): string[] {
  const words = new Set<string>();
  for (const raw of [...PRODUCT_WORDS, ...userInputs]) {
    const input = raw.toLowerCase().trim();
    const [local, domain = ''] = input.split('@');
    const labels = domain.split('.').slice(0, -1);
    // "Pat Ferris" is tried as itself, as "patferris", "pat" and "ferris"; an address by its parts too.
    for (const piece of [input, local, local.replace(/[^\p{L}\p{N}]+/gu, ''), ...tokens(local), ...labels, ...labels.flatMap(tokens)]) {
      if (piece.length >= 3) words.add(piece);
    }
  }
  // Longest first, so "pat ferris" goes before "pat".
  return [...words].sort((a, b) => b.length - a.length);
}

/** The password with every personal word taken out: what is left is all an informed attacker must guess. */
export function withoutPersonalWords(password: string, userInputs: string[]): string {
  let rest = password.toLowerCase();
  for (const word of personalWords(userInputs)) rest = rest.split(word).join('');
  return rest;
}

const strongEnough = (password: string, inputs: string[]) => {
  const result = checker().check(password.slice(0, 100), inputs);
  return { ok: result.score >= MIN_SCORE, result };
};

/**
 * Refuses short, overlong, common or guessable passwords with a message naming the field. The
 * product's name and the user's name, e-mail and team names are zxcvbn user inputs, and the password
 * must be strong both as it is and with those words taken out ("Pat Ferris" + "kitchen" is one word).
 */
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
  const inputs = [...personalWords(userInputs), ...userInputs];
  const whole = strongEnough(password, inputs);
  if (!whole.ok) {
    const hint = whole.result.feedback.warning || whole.result.feedback.suggestions[0] || 'Use a longer passphrase of unrelated words.';
    throw errors.badRequest('WEAK_PASSWORD', `Password is too easy to guess. ${hint}`.trim(), field);
  }
  const rest = withoutPersonalWords(password, userInputs);
  if (rest.length !== lower.length && !strongEnough(rest, inputs).ok) {
    throw errors.badRequest(
      'WEAK_PASSWORD',
      'Password is too easy to guess: without your name, e-mail, team name or "Lagline" too little is left. Add unrelated words.',
      field,
    );
  }
}

/** A random token for a link, and the hash we keep. */
export function newToken(): { token: string; hash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export const hashToken = (token: string) => crypto.createHash('sha256').update(token, 'utf8').digest('hex');
