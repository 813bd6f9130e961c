import { listOf, paginationQuery } from '../../http/pagination.ts';
import { defineRoute } from '../../http/route.ts';
import { z } from '../../openapi/zod.ts';

// Placeholder until ingest lands: the route, its scope and its contract exist; no samples yet.
const SampleSummarySchema = z.object({ id: z.string(), sample_code: z.string() }).openapi('SampleSummary');

export const sampleRoutes = [
  defineRoute({
    method: 'get',
    path: '/samples',
    operationId: 'listSamples',
    summary: 'List samples',
    tag: 'Samples',
    access: { scope: 'samples:read' },
    query: paginationQuery,
    responses: { 200: { description: 'A page of samples.', schema: listOf(SampleSummarySchema, 'SampleList') } },
    handler({ res }) {
      res.json({ data: [], next_cursor: null });
    },
  }),
];
