// Fuzzing every operation of openapi/openapi.json: requests generated from each operation's
// parameters and request schema (valid-shaped, mutated with hostile values, or broken) plus fixed
// hostile examples, sent with an all-scope API key. No answer may be 500 or more.
// FUZZ_SEED picks another seed, FUZZ_RUNS scales the number of runs (1 = the CI budget), and
// FUZZ_REPORT names a file that receives every 5xx as a line of JSON.
import { appendFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createFuzzApp, type FuzzApp } from './fuzz-app.ts';
import { describeRequest, document, type FuzzRequest, operations, send, serverError } from './fuzz-requests.ts';
import { fixedExamples } from './fixed-examples.ts';
import { requestArbitrary } from './request-arbitraries.ts';
import type { Vocabulary } from './schema-arbitrary.ts';

const SEED = Number(process.env.FUZZ_SEED ?? 20_261_217);
const SCALE = Number(process.env.FUZZ_RUNS ?? 1);
const REPORT = process.env.FUZZ_REPORT;
/**
 * Generated runs per operation: a fixed budget of 10,000 requests (at FUZZ_RUNS=1) shared by every
 * operation, those with a body weighted 260 : 140 (their input space is larger), so the suite's
 * time stays the same as operations are added.
 */
const GENERATED_BUDGET = 10_000;
const weightOf = (op: (typeof operations)[number]) => (op.body ? 260 : 140);
const totalWeight = operations.reduce((sum, op) => sum + weightOf(op), 0);
const runsFor = (op: (typeof operations)[number]) => Math.max(20, Math.round((SCALE * GENERATED_BUDGET * weightOf(op)) / totalWeight));

let app: FuzzApp;
let vocabulary: Vocabulary;
const totals = { fixed: 0, generated: 0 };
/** Answers by status class and operation, printed at the end: how deep the generated requests got. */
const statuses = new Map<string, Record<string, number>>();

beforeAll(async () => {
  app = await createFuzzApp([4200, 4249]);
  vocabulary = { schemas: document.components.schemas, ids: app.ids, emails: app.emails };
});
afterAll(async () => {
  const byClass = (cls: string) => [...statuses.values()].reduce((n, c) => n + (c[cls] ?? 0), 0);
  const classes = ['2xx', '3xx', '4xx', '5xx'].map((cls) => `${cls} ${byClass(cls)}`).join(', ');
  console.info(
    `fuzz: ${totals.generated} generated + ${totals.fixed} fixed requests over ${operations.length} operations (seed ${SEED}): ${classes}`,
  );
  if (process.env.FUZZ_STATUSES) console.table(Object.fromEntries(statuses));
  await app?.close();
});

describe('fuzz: no operation answers 5xx', () => {
  it('covers every operation of the OpenAPI document', () => {
    expect(operations.length).toBeGreaterThan(50);
    expect(operations.at(-1)?.operationId).toBe('logout');
  });

  it.each(operations.map((op, index) => [`${op.method.toUpperCase()} ${op.path}`, op, index] as const))(
    '%s',
    async (_name, op, index) => {
      // One seed per operation: with one for all, every operation would draw the same Idempotency-Keys.
      const seed = SEED + index * 7919;
      const failures: string[] = [];
      const counts: Record<string, number> = {};
      statuses.set(op.operationId, counts);
      const fail = (r: FuzzRequest, failure: string) => {
        failures.push(`${describeRequest(r)}\n→ ${failure}`);
        if (REPORT) appendFileSync(REPORT, `${JSON.stringify({ operation: op.operationId, request: describeRequest(r), failure })}\n`);
      };
      const run = async (r: FuzzRequest) => {
        let res;
        try {
          res = await send(app, r);
        } catch (error) {
          // No answer at all (the connection was reset): as much a server failure as a 5xx.
          return fail(r, `no answer: ${(error as Error).message}`);
        }
        const statusClass = `${Math.floor(res.status / 100)}xx`;
        counts[statusClass] = (counts[statusClass] ?? 0) + 1;
        const failure = serverError(res);
        if (failure) fail(r, failure);
      };
      for (const example of fixedExamples(op, vocabulary)) {
        totals.fixed += 1;
        await run(example);
      }
      await fc.assert(
        fc.asyncProperty(requestArbitrary(op, vocabulary), async (r) => {
          totals.generated += 1;
          await run(r);
        }),
        { numRuns: runsFor(op), seed },
      );
      const shown = failures.slice(0, 3).join('\n\n');
      expect(failures, `${failures.length} request(s) answered 5xx (seed ${seed}); the first:\n\n${shown}`).toEqual([]);
    },
    120_000,
  );
});
