import { activateStandardization } from '../../domain/drift/activation.service.ts';
import { CORRECTION_FLAGS_DOC, CORRECTION_MATH_DOC } from '../../domain/drift/drift-docs.ts';
import { listStandardizationsPage } from '../../domain/drift/standardization-view.ts';
import {
  ActivateStandardizationRequestSchema,
  CreateStandardizationRequestSchema,
  InstrumentStandardizationParams,
  StandardizationIdParams,
  StandardizationListQuerySchema,
  CreatedStandardizationSchema,
  StandardizationListSchema,
  StandardizationSchema,
} from '../../domain/drift/standardizations.schemas.ts';
import { createStandardization, getStandardization } from '../../domain/drift/standardizations.service.ts';
import { defineRoute } from '../../http/route.ts';
import { singleFileUpload } from '../../http/upload.ts';
import {
  ReadStandardizationFileRequestSchema,
  STANDARDIZATION_FILE_MAX_BYTES,
  StandardizationFileReadingSchema,
} from '../../domain/drift/standardization-file.schemas.ts';
import { readStandardizationFile } from '../../domain/drift/standardization-file.service.ts';

export const standardizationRoutes = [
  defineRoute({
    method: 'post',
    path: '/instruments/{id}/standardizations',
    operationId: 'createStandardization',
    summary: 'Run a standardization: per-element corrections from reference burns',
    description:
      "Send the burns of each reference material as measured (uncorrected), in `unit` (default: the method's). The run is stored as a `draft` with a correction per element of the method, its flag and reasons, and the slope and offset of the set in force for comparison; it changes nothing until activated (`POST /standardizations/{id}/activate`). A run with any `warn` or `fail` element records the event `standardization.flagged`. To read the burns from the instrument's result file, send it to `POST /instruments/{id}/standardizations/file` first.\n\n" +
      `${CORRECTION_MATH_DOC}\n\n${CORRECTION_FLAGS_DOC}`,
    tag: 'Drift correction',
    access: { scope: 'standardizations:write' },
    params: InstrumentStandardizationParams,
    body: CreateStandardizationRequestSchema,
    responses: {
      201: {
        description: 'Computed and stored as a draft.',
        schema: CreatedStandardizationSchema,
        headers: { Location: 'The new standardization.' },
      },
      404: { description: 'No such instrument.' },
      422: {
        description:
          'Unknown method or reference material; references that do not fit the mode (e.g. two_point without a high and a low, a control sample, another matrix); or no correction can be computed for an element (H = L): `errors[]` names each.',
      },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      const run = await createStandardization(ctx, auth, params.id, body, req.requestId);
      reply(201, run, { Location: `/api/v1/standardizations/${run.id}` });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/instruments/{id}/standardizations/file',
    operationId: 'readStandardizationFile',
    summary: 'Read the result file in which the reference materials were sparked',
    description:
      "Reads the file with the parser and import profiles of the sample import and stores nothing. Answers each sample of the file with its burns in % (the method's elements only), the reference material its code matches (ignoring case and separators; null when none does, so a client lets the user map it) and the latest burn time. Send the burns of the chosen samples to `POST /instruments/{id}/standardizations` with `unit` `%`, `measured_at` from the file and `source_file` to record where they came from.",
    tag: 'Drift correction',
    access: { scope: 'standardizations:write' },
    params: InstrumentStandardizationParams,
    body: ReadStandardizationFileRequestSchema,
    bodyContentType: 'multipart/form-data',
    before: () => [singleFileUpload('file', STANDARDIZATION_FILE_MAX_BYTES)],
    responses: {
      200: { description: 'How the file reads.', schema: StandardizationFileReadingSchema },
      404: { description: 'No such instrument.' },
      413: { description: `The file is larger than ${STANDARDIZATION_FILE_MAX_BYTES} bytes: not a standardization file.` },
      415: { description: 'Not a multipart/form-data request.' },
      422: {
        description:
          'The file cannot be read as result data (`errors[]` locates each issue as `file:line 12:Mn`, `issues[]` gives them structured), or the method or profile does not exist.',
      },
    },
    async handler({ params, body, auth, ctx, reply }) {
      reply(200, await readStandardizationFile(ctx, auth, params.id, body));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/instruments/{id}/standardizations',
    operationId: 'listStandardizations',
    summary: "List an instrument's standardization runs",
    description: 'Newest measurement first.',
    tag: 'Drift correction',
    access: { scope: 'standardizations:read' },
    params: InstrumentStandardizationParams,
    query: StandardizationListQuerySchema,
    responses: { 200: { description: 'A page of runs.', schema: StandardizationListSchema }, 404: { description: 'No such instrument.' } },
    async handler({ params, query, auth, ctx, reply }) {
      reply(200, await listStandardizationsPage(ctx, auth, params.id, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/standardizations/{id}',
    operationId: 'getStandardization',
    summary: 'Get a standardization run with its per-element corrections',
    tag: 'Drift correction',
    access: { scope: 'standardizations:read' },
    params: StandardizationIdParams,
    responses: { 200: { description: 'The run.', schema: StandardizationSchema }, 404: { description: 'No such standardization.' } },
    async handler({ params, auth, ctx, reply }) {
      reply(200, await getStandardization(ctx, auth, params.id));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/standardizations/{id}/activate',
    operationId: 'activateStandardization',
    summary: 'Activate a run: it becomes the correction set in force',
    description:
      'Managers and admins only (scope `standardizations:activate`; analysts run standardizations but do not activate them). The set is in force for its instrument and method from `effective_from` (default: now; a later time schedules it; an earlier one is refused) until a later activation takes over. Every burn stored afterwards is corrected with the set in force at its measurement time; results stored before are untouched. Records an audit entry and the event `standardization.activated` in the same transaction.\n\n' +
      'When any element is flagged `fail`, the body must carry `override_reason` (recorded), else 409 with `failing_elements`.',
    tag: 'Drift correction',
    access: { scope: 'standardizations:activate' },
    params: StandardizationIdParams,
    body: ActivateStandardizationRequestSchema,
    responses: {
      200: { description: 'Activated.', schema: StandardizationSchema },
      404: { description: 'No such standardization.' },
      409: {
        description:
          'Already activated; a run measured later is already activated; the method asks for a second person (`drift_limits.second_person_activation`) and the caller ran this standardization (`rule`: `second_person_activation`); or an element is flagged `fail` and no `override_reason` was given (`failing_elements` lists them).',
      },
      422: { description: '`effective_from` is in the past.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await activateStandardization(ctx, auth, params.id, body ?? {}, req.requestId));
    },
  }),
];
