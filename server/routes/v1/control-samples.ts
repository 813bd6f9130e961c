import {
  ChartQuerySchema,
  ChartSchema,
  ControlSampleIdParams,
  ControlSampleListQuerySchema,
  ControlSampleListSchema,
  ControlSampleSchema,
  CreateControlSampleRequestSchema,
  UpdateControlSampleRequestSchema,
} from '../../domain/control/control.schemas.ts';
import {
  createControlSample,
  getChart,
  getControlSample,
  listControlSamples,
  updateControlSample,
} from '../../domain/control/control.service.ts';
import { RUN_RULE_NAMES, RUN_RULES } from '../../domain/control/run-rules.ts';
import { defineRoute } from '../../http/route.ts';

const TAG = 'Control samples';
const RULE_SOURCES = RUN_RULE_NAMES.map((r) => `- \`${r}\`: ${RUN_RULES[r].title} — ${RUN_RULES[r].source}`).join('\n');

export const controlSampleRoutes = [
  defineRoute({
    method: 'get',
    path: '/control-samples',
    operationId: 'listControlSamples',
    summary: 'List control sample definitions with the latest status',
    tag: TAG,
    access: { scope: 'control:read' },
    query: ControlSampleListQuerySchema,
    responses: { 200: { description: 'A page of control samples, by code.', schema: ControlSampleListSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listControlSamples(ctx, auth, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/control-samples',
    operationId: 'createControlSample',
    summary: 'Define a control sample for an instrument and method',
    description:
      'Per element, enter a centre line and SD with their `source`, or leave them out to establish them from the first `baseline_n` points (the chart is provisional until then). Samples of kind `control` are linked by `control_sample_id` (JSON push) or by their sample code (file import).',
    tag: TAG,
    access: { scope: 'control:write' },
    body: CreateControlSampleRequestSchema,
    responses: {
      201: { description: 'Defined.', schema: ControlSampleSchema, headers: { Location: 'The new control sample.' } },
      409: { description: 'The code is taken for this instrument and method.' },
      422: { description: 'Unknown instrument, method or element.' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const created = await createControlSample(ctx, auth, body, req.requestId);
      reply(201, created, { Location: `/api/v1/control-samples/${created.id}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/control-samples/{id}',
    operationId: 'getControlSample',
    summary: 'Get a control sample definition',
    tag: TAG,
    access: { scope: 'control:read' },
    params: ControlSampleIdParams,
    responses: {
      200: { description: 'The control sample.', schema: ControlSampleSchema },
      404: { description: 'No such control sample.' },
    },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getControlSample(ctx, auth, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/control-samples/{id}',
    operationId: 'updateControlSample',
    summary: 'Change the description, run rules or limits of a control sample',
    description:
      'New limits apply from their `valid_from` (default now); the old ones are kept, and each point is judged with the limits in force when it was measured.',
    tag: TAG,
    access: { scope: 'control:write' },
    params: ControlSampleIdParams,
    body: UpdateControlSampleRequestSchema,
    responses: {
      200: { description: 'The changed control sample.', schema: ControlSampleSchema },
      404: { description: 'No such control sample.' },
      422: { description: 'An element that is not charted.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await updateControlSample(ctx, auth, params.id, body, req.requestId));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/control-samples/{id}/chart',
    operationId: 'getControlChart',
    summary: 'Control chart data of one element',
    description: `Points (drift-corrected mean of the included burns), limits in force per point, ±1/2/3σ of the current limits, limit validity periods and the moving range series. Rules are applied over all points; \`from\`/\`to\` only narrow what is returned. Run rules and their sources:\n${RULE_SOURCES}`,
    tag: TAG,
    access: { scope: 'control:read' },
    params: ControlSampleIdParams,
    query: ChartQuerySchema,
    responses: {
      200: { description: 'The chart.', schema: ChartSchema },
      404: { description: 'No such control sample.' },
      422: { description: 'The element is not charted.' },
    },
    async handler({ params, query, auth, ctx, reply }) {
      reply(200, await getChart(ctx, auth, params.id, query));
    },
  }),
];
