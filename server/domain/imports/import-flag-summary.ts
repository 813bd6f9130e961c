// The import report's flag summary: how many created samples carry each result flag, per
// element, so a reviewer sees at once where a file needs a closer look.
import type { Method } from '../methods/methods.repository.ts';
import { decodeResults } from '../samples/results-codec.ts';
import type { ImportReport } from './import-report.ts';

type FlagSummary = NonNullable<ImportReport['flag_summary']>;

export class FlagCounter {
  /** element ('' for the whole sample) → flag → samples */
  private readonly counts = new Map<string, Map<string, number>>();

  private add(element: string, flag: string): void {
    const flags = this.counts.get(element) ?? new Map<string, number>();
    flags.set(flag, (flags.get(flag) ?? 0) + 1);
    this.counts.set(element, flags);
  }

  /** Counts one built sample: each element's flags, and sample flags no element carries. */
  count(sample: { results_json: string; flags_json: string }): void {
    const onElements = new Set<string>();
    for (const result of decodeResults(sample.results_json)) {
      for (const flag of result.flags) {
        this.add(result.element, flag);
        onElements.add(flag);
      }
    }
    for (const flag of JSON.parse(sample.flags_json) as string[]) if (!onElements.has(flag)) this.add('', flag);
  }

  /** Rows in the method's element order, then other elements alphabetically, whole-sample flags last. */
  summary(method: Method): FlagSummary {
    const order = method.elements.map((e) => e.element);
    const rank = (element: string) => (element === '' ? Infinity : order.includes(element) ? order.indexOf(element) : order.length);
    const elements = [...this.counts.keys()].sort((a, b) => rank(a) - rank(b) || a.localeCompare(b));
    return elements.flatMap((element) =>
      [...this.counts.get(element)!.entries()]
        .sort(([a], [b]) => a.localeCompare(b))
        .map(([flag, samples]) => ({ element: element === '' ? null : element, flag, samples })),
    );
  }
}
