// How guessable a new password is, by zxcvbn-ts and its bundled dictionaries (common passwords, English words,
// names, keyboard patterns), all shipped inside the packages so the check works offline.
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';
import * as english from '@zxcvbn-ts/language-en';

// Score 3 of 4 ("safely unguessable: moderate protection from offline slow-hash attacks", zxcvbn's own scale).
export const MINIMUM_SCORE = 3;

let checker: ZxcvbnFactory | null = null;
const strengthChecker = () =>
  (checker ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...english.dictionary },
    graphs: common.adjacencyGraphs,
    translations: english.translations,
  }));

/** Null for a password hard enough to guess, or a sentence that says what to do instead. */
export function passwordWeakness(password: string, personalWords: string[] = []): string | null {
  const result = strengthChecker().check(password, ['patchwise', ...personalWords]);
  if (result.score >= MINIMUM_SCORE) return null;
  const hint = result.feedback.warning ? ` (${result.feedback.warning.replace(/\.$/, '')})` : '';
  return `That password is too easy to guess${hint}: use four or more unrelated words, or a longer mix that is not a common word, name, date or keyboard pattern.`;
}
