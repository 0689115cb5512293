import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';

/**
 * Password strength, the same on both sides: the server refuses weak passwords, the forms show
 * the same judgement as a hint while typing. zxcvbn-ts with its common dictionary (the most used
 * passwords, names and words, keyboard patterns): a password must score at least 3 of 4 ("safely
 * unguessable", about 10^8 guesses), and must not contain the e-mail address, its name part or
 * the product's name (OWASP ASVS 5.0 6.2.4, 6.2.11).
 */
export const MIN_PASSWORD_SCORE = 3;

const PRODUCT_WORDS = ['spoolbook'];

let factory: ZxcvbnFactory | null = null;
function estimator() {
  factory ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs });
  return factory;
}

export interface PasswordJudgement {
  /** 0 (guessed at once) … 4 (very hard to guess). */
  score: number;
  /** Why it is refused, in plain words; null when it is strong enough. */
  problem: string | null;
  /** A short hint for the form. */
  hint: string;
}

/** The parts of the account a password must not be built from. */
function personalWords(context: { email?: string; name?: string }): string[] {
  const words = [...PRODUCT_WORDS];
  const email = context.email?.trim().toLowerCase();
  if (email) {
    words.push(email);
    const local = email.split('@')[0];
    if (local.length >= 3) words.push(local);
  }
  for (const part of (context.name ?? '').toLowerCase().split(/\s+/)) if (part.length >= 3) words.push(part);
  return words;
}

const HINTS = ['Very easy to guess', 'Easy to guess', 'Could be guessed', 'Strong', 'Very strong'];

export function judgePassword(password: string, context: { email?: string; name?: string } = {}): PasswordJudgement {
  if (password.length === 0) return { score: 0, problem: 'is required', hint: '' };
  const lower = password.toLowerCase();
  const words = personalWords(context);
  const result = estimator().check(password.slice(0, 128), words);
  const score = result.score;
  const hint = HINTS[score];
  if (password.length < 8) return { score, problem: 'must be at least 8 characters', hint: 'Too short: use at least 8 characters' };
  const own = words.find((w) => lower.includes(w));
  if (own) {
    const what = PRODUCT_WORDS.includes(own)
      ? "the product's name"
      : own.includes('@') || (context.email ?? '').toLowerCase().startsWith(own)
        ? 'your e-mail address'
        : 'your name';
    return { score: Math.min(score, 1), problem: `must not contain ${what}`, hint: `Contains ${what}` };
  }
  if (score < MIN_PASSWORD_SCORE) {
    const why = result.feedback.warning ? ` (${warningText(result.feedback.warning)})` : '';
    return { score, problem: `is too easy to guess${why}; try a few unrelated words together`, hint: `${hint}: try a few unrelated words together` };
  }
  return { score, problem: null, hint };
}

/** zxcvbn's warning keys in our own words. */
function warningText(key: string): string {
  const words: Record<string, string> = {
    topTen: 'it is one of the most used passwords',
    topHundred: 'it is among the most used passwords',
    common: 'it is a common password',
    similarToCommon: 'it is close to a common password',
    sequences: 'it is a simple sequence',
    recentYears: 'it is a recent year',
    dates: 'it is a date',
    keyPattern: 'it follows a keyboard pattern',
    straightRow: 'it is a row of keys',
    simpleRepeat: 'it repeats characters',
    extendedRepeat: 'it repeats a pattern',
    namesByThemselves: 'it is a name',
    commonNames: 'it is a common name',
    userInputs: 'it contains your own details',
    wordByItself: 'it is a single word',
  };
  return words[key] ?? 'it follows a common pattern';
}
