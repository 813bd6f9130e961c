import {
  CreateInstrumentRequestSchema,
  InstrumentDetailSchema,
  InstrumentIdParams,
  InstrumentListQuerySchema,
  InstrumentListSchema,
  InstrumentSchema,
  UpdateInstrumentRequestSchema,
} from '../../domain/instruments/instruments.schemas.ts';
import { createInstrument, listInstrumentsPage, updateInstrument } from '../../domain/instruments/instruments.service.ts';
import { defineRoute } from '../../http/route.ts';
import { ControlStatusChangeSchema, DispositionRequestSchema } from '../../domain/control/control.schemas.ts';
import { getInstrumentDetail, recordDisposition } from '../../domain/control/control-status.ts';

export const instrumentRoutes = [
  defineRoute({
    method: 'get',
    path: '/instruments',
    operationId: 'listInstruments',
    summary: 'List instruments',
    description: 'Ordered by code. A key restricted to some instruments sees only those.',
    tag: 'Instruments',
    access: { scope: 'samples:read' },
    query: InstrumentListQuerySchema,
    responses: { 200: { description: 'A page of instruments.', schema: InstrumentListSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listInstrumentsPage(ctx, auth, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/instruments',
    operationId: 'createInstrument',
    summary: 'Register an instrument',
    tag: 'Instruments',
    access: { scope: 'instruments:write', labWide: true },
    body: CreateInstrumentRequestSchema,
    responses: {
      201: { description: 'Registered.', schema: InstrumentSchema, headers: { Location: 'The new instrument.' } },
      409: { description: 'The code is taken (codes are compared ignoring case).' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const instrument = await createInstrument(ctx, auth, body, req.requestId);
      reply(201, instrument, { Location: `/api/v1/instruments/${instrument.id}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/instruments/{id}',
    operationId: 'getInstrument',
    summary: 'Get an instrument',
    tag: 'Instruments',
    access: { scope: 'samples:read' },
    params: InstrumentIdParams,
    description:
      'With its control status per method (`verify` after a control rule violation, until a disposition), the reason and the history.',
    responses: { 200: { description: 'The instrument.', schema: InstrumentDetailSchema }, 404: { description: 'No such instrument.' } },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getInstrumentDetail(ctx, auth, params.id));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/instruments/{id}/control-dispositions',
    operationId: 'recordControlDisposition',
    summary: 'Record the disposition of a control violation',
    description:
      'Cause and action (e.g. "electrode re-gapped, control re-run in control"); the instrument is `in_control` again for the method.',
    tag: 'Instruments',
    access: { scope: 'control:write' },
    params: InstrumentIdParams,
    body: DispositionRequestSchema,
    responses: {
      201: { description: 'Recorded.', schema: ControlStatusChangeSchema },
      404: { description: 'No such instrument.' },
      409: { description: 'The instrument is in control for the method.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(201, await recordDisposition(ctx, auth, params.id, body, req.requestId));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/instruments/{id}',
    operationId: 'updateInstrument',
    summary: "Change an instrument's code, name or site",
    tag: 'Instruments',
    access: { scope: 'instruments:write', labWide: true },
    params: InstrumentIdParams,
    body: UpdateInstrumentRequestSchema,
    responses: {
      200: { description: 'The updated instrument.', schema: InstrumentSchema },
      404: { description: 'No such instrument.' },
      409: { description: 'The new code is taken.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await updateInstrument(ctx, auth, params.id, body, req.requestId));
    },
  }),
];
