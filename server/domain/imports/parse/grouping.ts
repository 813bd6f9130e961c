// Rows → samples. Consecutive rows with the same sample code and heat form one sample; when a
// pair comes back after other samples it starts a new sample (with a warning), because the
// instrument wrote it as a separate measurement. Burn numbers are claimed per sample.
import type { Issue, ParsedBurn, ParsedSample } from './types.ts';

export interface RowIdentity {
  sample_code: string;
  heat?: string;
  grade?: string;
  kind?: string;
  fields: Record<string, string>;
}

export interface SampleState {
  sample: ParsedSample;
  burns: Map<number, ParsedBurn>;
  nextBurn: number;
  warned: Set<string>;
  /** Long layout without burn numbers: the burn that rows are currently filling. */
  openBurn?: ParsedBurn;
}

export class SampleGrouper {
  private readonly states: SampleState[] = [];
  private current: SampleState | undefined;
  private currentKey = '';
  private readonly firstLine = new Map<string, number>();

  constructor(
    private readonly warnings: Issue[],
    private readonly rejected: Issue[],
    /** Header of the column behind each identification key ("grade", "fields.Furnace"). */
    private readonly headerOf: (key: string) => string | undefined,
  ) {}

  /** The row's sample; `compare: false` for a rejected row, whose identification is not compared. */
  enter(identity: RowIdentity, line: number, options: { compare: boolean } = { compare: true }): SampleState {
    const key = `${identity.sample_code}\u0000${identity.heat ?? ''}`;
    if (this.current && key === this.currentKey) {
      if (options.compare) this.checkSame(this.current, identity, line);
      return this.current;
    }
    const earlier = this.firstLine.get(key);
    if (earlier !== undefined) {
      this.warnings.push({
        line,
        code: 'sample_repeated',
        message: `Sample ${describe(identity)} appears again on line ${line} after other samples (first on line ${earlier}); it is read as a separate sample.`,
      });
    } else this.firstLine.set(key, line);
    const { sample_code, heat, grade, kind, fields } = identity;
    const sample: ParsedSample = {
      sample_code,
      ...(heat ? { heat } : {}),
      ...(grade ? { grade } : {}),
      ...(kind ? { kind } : {}),
      fields,
      first_line: line,
      burns: [],
      rejected: [],
    };
    this.current = { sample, burns: new Map(), nextBurn: 1, warned: new Set() };
    this.currentKey = key;
    this.states.push(this.current);
    return this.current;
  }

  /** Records rejected issues for the file and, when known, for the sample. */
  reject(issues: Issue[], state?: SampleState): void {
    this.rejected.push(...issues);
    state?.sample.rejected.push(...issues);
  }

  /** Samples with at least one burn, burns in number order. */
  finish(): ParsedSample[] {
    return this.states
      .filter((state) => state.burns.size > 0)
      .map((state) => ({ ...state.sample, burns: [...state.burns.values()].sort((a, b) => a.burn_number - b.burn_number) }));
  }

  private checkSame(state: SampleState, identity: RowIdentity, line: number): void {
    const { sample } = state;
    const pairs: [string, string | undefined, string | undefined][] = [
      ['grade', sample.grade, identity.grade],
      ['kind', sample.kind, identity.kind],
      ...Object.keys({ ...sample.fields, ...identity.fields }).map((k): [string, string | undefined, string | undefined] => [
        `fields.${k}`,
        ownField(sample.fields, k),
        ownField(identity.fields, k),
      ]),
    ];
    for (const [key, first, now] of pairs) {
      if ((first ?? '') === (now ?? '') || state.warned.has(key)) continue;
      state.warned.add(key);
      this.warnings.push({
        line,
        column: this.headerOf(key),
        code: 'identification_changed',
        message: `Line ${line} gives "${now ?? ''}" where sample ${describe(identity)} began on line ${sample.first_line} with "${first ?? ''}"; the first is kept.`,
      });
    }
  }
}

/** A field the row has: a column named "constructor" must not read Object's constructor. */
function ownField(fields: Record<string, string>, key: string): string | undefined {
  return Object.hasOwn(fields, key) ? fields[key] : undefined;
}

function describe(identity: RowIdentity): string {
  return identity.heat ? `${identity.sample_code} (heat ${identity.heat})` : identity.sample_code;
}
