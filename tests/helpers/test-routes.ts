// Test-only operations added beside the real ones, for behaviour no real route shows yet:
// a write that waits until the test lets it finish, one that fails with 500 on demand, and a
// multipart upload parsed by multer in `before` (as upload routes do).
import multer from 'multer';
import { defineRoute } from '../../server/http/route.ts';
import { z } from '../../server/lib/zod.ts';

const Counted = z.object({ call: z.number().int(), file_size: z.number().int().optional() }).openapi('TestCounted');

export function testRoutes() {
  let calls = 0;
  let gate: { entered: () => void; release: Promise<void> } | undefined;
  let failNext = false;

  const routes = [
    defineRoute({
      method: 'post',
      path: '/test/slow-write',
      operationId: 'testSlowWrite',
      summary: 'Test only: waits for the test to release it',
      tag: 'Test',
      access: { scope: 'samples:write' },
      body: z.object({ value: z.string() }),
      responses: { 201: { description: 'Done.', schema: Counted } },
      async handler({ res }) {
        calls += 1;
        const call = calls;
        if (gate) {
          gate.entered();
          await gate.release;
        }
        res.status(201).json({ call });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/test/flaky-write',
      operationId: 'testFlakyWrite',
      summary: 'Test only: fails with 500 when told to',
      tag: 'Test',
      access: { scope: 'samples:write' },
      body: z.object({ value: z.string() }),
      responses: { 201: { description: 'Done.', schema: Counted } },
      handler({ res }) {
        calls += 1;
        if (failNext) {
          failNext = false;
          throw new Error('simulated failure');
        }
        res.status(201).json({ call: calls });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/test/upload',
      operationId: 'testUpload',
      summary: 'Test only: a multipart upload',
      tag: 'Test',
      access: { scope: 'imports:write' },
      bodyContentType: 'multipart/form-data',
      before: () => [multer({ storage: multer.memoryStorage() }).single('file')],
      responses: { 201: { description: 'Stored.', schema: Counted } },
      handler({ req, res }) {
        calls += 1;
        res.status(201).json({ call: calls, file_size: req.file?.size ?? 0 });
      },
    }),
  ];

  return {
    routes,
    get calls() {
      return calls;
    },
    failNextCall() {
      failNext = true;
    },
    /** Holds the next slow writes until `release()`; `entered` resolves when the first one is inside. */
    hold() {
      let release!: () => void;
      let entered!: () => void;
      const inside = new Promise<void>((resolve) => (entered = resolve));
      gate = { entered, release: new Promise<void>((resolve) => (release = resolve)) };
      return {
        inside,
        release: () => {
          gate = undefined;
          release();
        },
      };
    },
  };
}
