// The result rules and flags, as the API reference shows them.
import { RESULT_FLAGS, RESULT_RULES } from '../chemistry/element-result.ts';

const flags = Object.entries(RESULT_FLAGS)
  .map(([name, description]) => `- \`${name}\`: ${description}`)
  .join('\n');

export const RESULTS_DESCRIPTION = `**How results are computed** (per element, over the included burns; mass fractions in %, converted exactly for \`unit=ppm|ppb\`):\n\n${RESULT_RULES}\n\n**Result flags**\n\n${flags}\n\nResults must be reviewed and authorised under the laboratory's own procedures before release.`;
