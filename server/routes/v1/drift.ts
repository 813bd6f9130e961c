import { correctionsInForce, driftHistory } from '../../domain/drift/drift-history.service.ts';
import { CORRECTION_APPLY_DOC } from '../../domain/drift/drift-docs.ts';
import {
  CorrectionsInForceSchema,
  CorrectionsQuerySchema,
  DriftHistorySchema,
  DriftQuerySchema,
  InstrumentStandardizationParams,
} from '../../domain/drift/standardizations.schemas.ts';
import { defineRoute } from '../../http/route.ts';

export const driftRoutes = [
  defineRoute({
    method: 'get',
    path: '/instruments/{id}/drift',
    operationId: 'getDriftHistory',
    summary: 'Slope and offset of one element over time',
    description:
      'One point per standardization run (drafts included, with their flag and activation state), oldest first: the latest `limit` runs in the time window. This is a series for charting, not a paged list. Slopes and offsets are decimal strings; null where the run did not correct the element.',
    tag: 'Drift correction',
    access: { scope: 'standardizations:read' },
    params: InstrumentStandardizationParams,
    query: DriftQuerySchema,
    responses: { 200: { description: 'The series.', schema: DriftHistorySchema }, 404: { description: 'No such instrument.' } },
    async handler({ params, query, auth, ctx, reply }) {
      reply(200, await driftHistory(ctx, auth, params.id, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/instruments/{id}/corrections',
    operationId: 'getCorrectionsInForce',
    summary: 'The correction sets in force, per method',
    description: CORRECTION_APPLY_DOC,
    tag: 'Drift correction',
    access: { scope: 'standardizations:read' },
    params: InstrumentStandardizationParams,
    query: CorrectionsQuerySchema,
    responses: {
      200: { description: 'The sets in force.', schema: CorrectionsInForceSchema },
      404: { description: 'No such instrument.' },
    },
    async handler({ params, query, auth, ctx, reply }) {
      reply(200, await correctionsInForce(ctx, auth, params.id, query.at));
    },
  }),
];
