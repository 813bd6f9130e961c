// How many burns must stay included: the method's reporting rule `min_included_burns` (default 2,
// so a result always rests on burns that can be compared). Applied to every way of excluding a
// burn — the draft's PATCH, an amendment and the exclusion preview — with the same words.
import type { Method } from '../methods/methods.repository.ts';

interface BurnState {
  burn_number: number;
  excluded: boolean | number;
}

/** Why going from `before` to `next` (burn states) is refused, in words for the analyst; null when allowed. */
export function tooFewIncludedBurns(next: readonly BurnState[], before: readonly BurnState[], method: Method): string | null {
  const minimum = method.reporting.min_included_burns;
  const includedAfter = next.filter((b) => !b.excluded).length;
  const includedBefore = before.filter((b) => !b.excluded).length;
  // Only an exclusion is refused: a sample stored with fewer burns keeps them, and including one is always allowed.
  if (includedAfter >= minimum || includedAfter >= includedBefore) return null;
  if (includedAfter === 0)
    return 'This would exclude every burn; at least one must stay included. Include another one first, or measure the sample again.';
  const burns = minimum === 1 ? 'one included burn' : `${minimum} included burns`;
  return `Method ${method.code} needs at least ${burns} for a result, and this would leave ${includedAfter}. Spark the sample again (or include another burn first), then exclude this one.`;
}

/** The problem extension members of a refusal: the method's minimum and how many burns are included now. */
export function minimumBurnsExtension(burns: readonly BurnState[], method: Method) {
  return { min_included_burns: method.reporting.min_included_burns, included_burns: burns.filter((b) => !b.excluded).length };
}
