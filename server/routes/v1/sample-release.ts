import { amendSample, getRevision, getRevisions } from '../../domain/samples/amendments.service.ts';
import { releaseSample, releaseSamples } from '../../domain/samples/release.service.ts';
import {
  AmendmentRequestSchema,
  ReleaseBatchRequestSchema,
  ReleaseRequestSchema,
  RevisionListSchema,
  RevisionParams,
  SampleIdParams,
  SampleSchema,
} from '../../domain/samples/samples.schemas.ts';
import { defineRoute } from '../../http/route.ts';
import { z } from '../../lib/zod.ts';

const RULES =
  'A released sample no longer changes: burn exclusion and recompute answer 409. A sample that does not conform to its grade, or could not be judged, is released only as a concession (`accept_nonconforming: true` with a `comment`). When the lab requires independent release (`RELEASE_REQUIRES_SECOND_PERSON`, on by default), whoever created the sample or last changed its burns — for an API key, its owner — cannot release it. Records `sample.released`. Release follows your laboratory’s accredited review and authorisation procedures; Meltwire records them.';

export const sampleReleaseRoutes = [
  defineRoute({
    method: 'post',
    path: '/samples/{id}/release',
    operationId: 'releaseSample',
    summary: "Release a sample's results",
    description: RULES,
    tag: 'Samples',
    access: { scope: 'samples:release' },
    params: SampleIdParams,
    body: ReleaseRequestSchema,
    responses: {
      200: { description: 'Released.', schema: SampleSchema },
      403: { description: 'The caller created the sample or last changed its burns, and this lab requires another person to release it.' },
      404: { description: 'No such sample.' },
      409: { description: 'Already released: amend it instead.' },
      422: { description: 'It does not conform (or could not be judged) and was not released as a concession.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await releaseSample(ctx, auth, params.id, body, req.requestId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/samples/release',
    operationId: 'releaseSamples',
    summary: 'Release several samples (a heat) together, all or none',
    description: `Every listed sample is released in one transaction, or none: the 422 names each one that cannot be in \`errors[]\`. ${RULES}`,
    tag: 'Samples',
    access: { scope: 'samples:release' },
    body: ReleaseBatchRequestSchema,
    responses: {
      200: {
        description: 'All released, in the order listed.',
        schema: z.object({ data: z.array(SampleSchema) }).openapi('ReleasedSamples'),
      },
      422: { description: 'None was released; see errors[].' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      reply(200, await releaseSamples(ctx, auth, body, req.requestId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/samples/{id}/amendments',
    operationId: 'amendSample',
    summary: 'Amend a released sample: a new revision, the earlier ones kept',
    description:
      'Exclude or include burns again, correct heat, grade (regrading) or fields, with a reason. The sample stays released; `revision` goes from n to n + 1, every revision stays readable exactly as it was served, and `sample.amended` carries both revision numbers and the changed elements.',
    tag: 'Samples',
    access: { scope: 'samples:release' },
    params: SampleIdParams,
    body: AmendmentRequestSchema,
    responses: {
      201: { description: 'Amended: the new revision.', schema: SampleSchema, headers: { Location: 'The new revision.' } },
      404: { description: 'No such sample.' },
      409: { description: 'The sample is a draft: change it directly.' },
      422: { description: 'A burn that does not exist, or no burn left included; nothing was amended.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      const sample = await amendSample(ctx, auth, params.id, body, req.requestId);
      reply(201, sample, { Location: `/api/v1/samples/${sample.id}/revisions/${sample.revision}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/samples/{id}/revisions',
    operationId: 'listSampleRevisions',
    summary: "A released sample's revisions: who, when, why and what changed",
    tag: 'Samples',
    access: { scope: 'samples:read' },
    params: SampleIdParams,
    responses: {
      200: { description: 'Oldest first; empty while the sample is a draft.', schema: RevisionListSchema },
      404: { description: 'No such sample.' },
    },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getRevisions(ctx, auth, params.id));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/samples/{id}/revisions/{n}',
    operationId: 'getSampleRevision',
    summary: 'One revision of a sample, exactly as it was served',
    tag: 'Samples',
    access: { scope: 'samples:read' },
    params: RevisionParams,
    responses: {
      200: { description: 'That revision (results in %).', schema: SampleSchema },
      404: { description: 'No such sample or revision.' },
    },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getRevision(ctx, auth, params.id, params.n));
    },
  }),
];
