import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as common from "@zxcvbn-ts/language-common";
import * as en from "@zxcvbn-ts/language-en";

// zxcvbn-ts with its common-password and English dictionaries, shipped in node_modules (nothing fetched).
let estimator: ZxcvbnFactory | null = null;
function zxcvbn(): ZxcvbnFactory {
  estimator ??= new ZxcvbnFactory({
    dictionary: { ...common.dictionary, ...en.dictionary },
    graphs: common.adjacencyGraphs,
    translations: en.translations,
  });
  return estimator;
}

/**
 * A password must score at least this on zxcvbn's 0–4 scale: 4 is "very unguessable" (10^10 guesses or more).
 * Score 3 lets through two names and a year ("tidewellmarr2026" estimates at 10^8), which the studio's own
 * words make easy to guess; a phrase of unrelated words or a random string scores 4.
 */
export const MIN_PASSWORD_SCORE = 4;

/**
 * Why a password is too weak, or null when it will do: common passwords, keyboard walks and ones built
 * from the person's e-mail, name or the studio's name are refused (OWASP Authentication Cheat Sheet:
 * check against known-breached and context-specific words).
 */
export async function passwordProblem(password: string, context: string[]): Promise<string | null> {
  const words = context.flatMap((c) => c.toLowerCase().split(/[^\p{L}\p{N}]+/u)).filter((w) => w.length >= 3);
  const result = await zxcvbn().checkAsync(password, words);
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  const hint = result.feedback.warning ? `${result.feedback.warning.replace(/\.$/, "")}. ` : "";
  return `This password is too easy to guess. ${hint}Use a longer phrase of unrelated words, not built from the name, the e-mail address or the studio's name.`;
}
