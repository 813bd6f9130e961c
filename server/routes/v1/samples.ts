import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import {
  BurnParams,
  PushSampleBatchRequestSchema,
  PushSampleRequestSchema,
  SampleBatchResponseSchema,
  SampleIdParams,
  SampleListQuerySchema,
  SampleListSchema,
  SampleSchema,
  SetBurnExclusionRequestSchema,
  UnitQuerySchema,
} from '../../domain/samples/samples.schemas.ts';
import { pushSamples, setBurnExclusion } from '../../domain/samples/samples.service.ts';
import { loadSampleDetail } from '../../domain/samples/sample-view.ts';
import { preparedSampleDetail } from '../../domain/samples/prepared-documents.ts';
import { PreparedJson } from '../../lib/prepared-json.ts';
import { CSV_MAX_ROWS, exportSamplesCsv, listSamplesPage } from '../../domain/samples/sample-lists.ts';
import { RESULTS_DESCRIPTION } from '../../domain/samples/results-docs.ts';
import { BurnExclusionPreviewQuerySchema, BurnExclusionPreviewSchema } from '../../domain/samples/burn-exclusion.schemas.ts';
import { previewBurnExclusion } from '../../domain/samples/burn-exclusion-preview.ts';
import { z } from '../../lib/zod.ts';
import { defineRoute } from '../../http/route.ts';

export const sampleRoutes = [
  defineRoute({
    method: 'get',
    path: '/samples',
    operationId: 'listSamples',
    summary: 'List samples with their results',
    description:
      'Newest first by default. With `updated_since`, ordered by last change (oldest first) so an integration can poll: keep the last `updated_at` you saw and pass it next time. Filters combine with AND.\n\n' +
      RESULTS_DESCRIPTION,
    tag: 'Samples',
    access: { scope: 'samples:read' },
    query: SampleListQuerySchema,
    responses: { 200: { description: 'A page of samples (burns are on the single-sample endpoint).', schema: SampleListSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listSamplesPage(ctx, auth, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/samples.csv',
    operationId: 'exportSamplesCsv',
    summary: 'Export samples as CSV',
    description: `The same filters as the list, every matching sample (up to ${CSV_MAX_ROWS}), newest first: one row per sample, one column per element holding the reported value with its qualifier (e.g. "<0.002"). Text cells that a spreadsheet would evaluate (starting with =, +, -, @) are prefixed with a quote. The matching samples are counted first, so a refusal comes at once; the CSV is then streamed (chunked), a page of samples at a time.`,
    tag: 'Samples',
    access: { scope: 'samples:read' },
    query: SampleListQuerySchema.omit({ cursor: true, limit: true }),
    responses: {
      200: { description: 'UTF-8 CSV with a header row.', contentType: 'text/csv', schema: z.string() },
      422: { description: `More than ${CSV_MAX_ROWS} samples match: narrow the filters.` },
    },
    async handler({ query, auth, res, ctx }) {
      // Refusals (422) come before the first byte; then the CSV streams, a page of samples at a time.
      const csv = await exportSamplesCsv(ctx, auth, query);
      res.type('text/csv; charset=utf-8');
      res.attachment(`samples-${new Date().toISOString().slice(0, 10)}.csv`);
      await pipeline(Readable.from(csv), res);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/samples',
    operationId: 'pushSample',
    summary: 'Push one sample with its burns (JSON)',
    description:
      'Element symbols are normalised (MN → Mn); values are numbers or strings such as "<0.0005", ">1.5" or "n.d.", in `unit` (default: the method\'s). Nothing is stored when any value is wrong: the 400 problem names each one in `errors[]`. Unknown instrument or method → 422.',
    tag: 'Samples',
    access: { scope: 'samples:write' },
    body: PushSampleRequestSchema,
    responses: {
      201: { description: 'Stored, with results computed.', schema: SampleSchema, headers: { Location: 'The new sample.' } },
      422: { description: 'The instrument or method does not exist.' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const [stored] = await pushSamples(ctx, auth, [body], false, req.requestId);
      reply(201, new PreparedJson(stored.document), { Location: `/api/v1/samples/${stored.id}` });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/samples/batch',
    operationId: 'pushSampleBatch',
    summary: 'Push many samples in one transaction',
    description: 'All samples are stored, or none: any problem answers 400/422 with `errors[]` located as `body.samples.<i>…`.',
    tag: 'Samples',
    access: { scope: 'samples:write' },
    body: PushSampleBatchRequestSchema,
    responses: {
      201: { description: 'All stored, in request order.', schema: SampleBatchResponseSchema },
      422: { description: 'An instrument or method does not exist.' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const stored = await pushSamples(ctx, auth, body.samples, true, req.requestId);
      reply(201, new PreparedJson(`{"data":[${stored.map((s) => s.document).join(',')}]}`));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/samples/{id}',
    operationId: 'getSample',
    summary: 'Get a sample: results, burns and provenance',
    description: RESULTS_DESCRIPTION,
    tag: 'Samples',
    access: { scope: 'samples:read' },
    params: SampleIdParams,
    query: UnitQuerySchema,
    responses: { 200: { description: 'The sample.', schema: SampleSchema }, 404: { description: 'No such sample.' } },
    async handler({ params, query, auth, ctx, reply }) {
      reply(
        200,
        query.unit === '%'
          ? await preparedSampleDetail(ctx.db, auth, params.id)
          : await loadSampleDetail(ctx.db, auth, params.id, query.unit),
      );
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/samples/{id}/burns/{n}',
    operationId: 'setBurnExclusion',
    summary: 'Exclude a burn from the results, or include it again',
    description:
      "The burn is never deleted. The results are recomputed, and the change is audited with the reason, who and when. Refused with 409 when the sample is released (amend it instead) or when the exclusion would leave fewer included burns than the method's `reporting.min_included_burns` (default 2; the problem carries `min_included_burns` and `included_burns`). GET /samples/{id}/burns/{n}/exclusion-preview says beforehand what the change would do.",
    tag: 'Samples',
    access: { scope: 'samples:write' },
    params: BurnParams,
    body: SetBurnExclusionRequestSchema,
    responses: {
      200: { description: 'The sample with recomputed results.', schema: SampleSchema },
      404: { description: 'No such sample or burn.' },
      409: { description: 'The sample is released, or the exclusion would leave fewer included burns than the method requires.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      await setBurnExclusion(ctx, auth, params.id, params.n, body, req.requestId);
      reply(200, await loadSampleDetail(ctx.db, auth, params.id, '%'));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/samples/{id}/burns/{n}/exclusion-preview',
    operationId: 'previewBurnExclusion',
    summary: 'Preview excluding (or including) a burn',
    description:
      'Computes the results as PATCH /samples/{id}/burns/{n} would, without storing anything, and lists per element the reported value before and after and the flags the change would clear or raise (e.g. `repeatability_exceeded` cleared by excluding the outlier), the sample flags and the verdict against the grade. `allowed` and `refusal` say whether the change would be accepted now. Nothing is audited.',
    tag: 'Samples',
    access: { scope: 'samples:read' },
    params: BurnParams,
    query: BurnExclusionPreviewQuerySchema,
    responses: {
      200: { description: 'What the change would do.', schema: BurnExclusionPreviewSchema },
      404: { description: 'No such sample or burn.' },
    },
    async handler({ params, query, auth, ctx, reply }) {
      reply(200, await previewBurnExclusion(ctx.db, auth, params.id, params.n, query.excluded, query.unit));
    },
  }),
];
