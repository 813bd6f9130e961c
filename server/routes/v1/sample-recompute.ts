import { CORRECTION_APPLY_DOC } from '../../domain/drift/drift-docs.ts';
import { recomputeSample } from '../../domain/drift/recompute.service.ts';
import { RecomputeSampleRequestSchema } from '../../domain/drift/recompute.schemas.ts';
import { SampleIdParams, SampleSchema } from '../../domain/samples/samples.schemas.ts';
import { loadSampleDetail } from '../../domain/samples/sample-view.ts';
import { defineRoute } from '../../http/route.ts';

export const sampleRecomputeRoutes = [
  defineRoute({
    method: 'post',
    path: '/samples/{id}/recompute',
    operationId: 'recomputeSample',
    summary: "Recompute a sample's results against another correction set, or none",
    description:
      'Every burn is corrected with the activated set named in `correction_set_id` (of the sample\'s instrument and method), or left uncorrected with `null`; the results are recomputed from the kept measured values. The reason, who and when are stored with the sample (`correction.selection = "requested"`) and the audit trail keeps the results before and after. Released samples cannot be recomputed (409).\n\n' +
      CORRECTION_APPLY_DOC,
    tag: 'Samples',
    access: { scope: 'samples:write' },
    params: SampleIdParams,
    body: RecomputeSampleRequestSchema,
    responses: {
      200: { description: 'The sample with recomputed results.', schema: SampleSchema },
      404: { description: 'No such sample.' },
      409: { description: 'The sample is released.' },
      422: { description: 'The set does not exist, is a draft, or belongs to another instrument or method.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      await recomputeSample(ctx, auth, params.id, body, req.requestId);
      reply(200, await loadSampleDetail(ctx.db, auth, params.id, '%'));
    },
  }),
];
