import { GradeEvaluationSchema, GradeMatchListSchema } from '../../domain/grades/evaluation.schemas.ts';
import {
  CreateGradeRequestSchema,
  EvaluateRequestSchema,
  GradeCodeParams,
  GradeListQuerySchema,
  GradeListSchema,
  GradeSchema,
  GradeVersionParams,
  MatchRequestSchema,
  UpdateGradeRequestSchema,
} from '../../domain/grades/grades.schemas.ts';
import {
  createGrade,
  evaluateGrade,
  getGrade,
  getGradeVersion,
  getGradeVersions,
  listGradesPage,
  matchGrades,
  updateGrade,
} from '../../domain/grades/grades.service.ts';
import { defineRoute } from '../../http/route.ts';
import { z } from '../../lib/zod.ts';

const CAUTION =
  'Limits come from the grade as entered: verify them against your licensed copy of the standard. A verdict supports, and never replaces, release under your laboratory’s accredited procedures.';

export const gradeRoutes = [
  defineRoute({
    method: 'get',
    path: '/grades',
    operationId: 'listGrades',
    summary: 'List grades (latest versions)',
    description: 'Ordered by code, ignoring case.',
    tag: 'Grades',
    access: { scope: 'grades:read' },
    query: GradeListQuerySchema,
    responses: { 200: { description: 'A page of grades.', schema: GradeListSchema } },
    async handler({ query, ctx, reply }) {
      reply(200, await listGradesPage(ctx, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/grades',
    operationId: 'createGrade',
    summary: 'Define a grade: its limits and the decision rule',
    description: `Limits, aims and "others" are decimal strings: their written decimals set the rounding place (a JSON number there is a 400). ${CAUTION}`,
    tag: 'Grades',
    access: { scope: 'grades:write', labWide: true },
    body: CreateGradeRequestSchema,
    responses: {
      201: { description: 'Created as version 1.', schema: GradeSchema, headers: { Location: 'The new grade.' } },
      409: { description: 'A grade with this code exists (codes are unique ignoring case).' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const grade = await createGrade(ctx, auth, body, req.requestId);
      reply(201, grade, { Location: `/api/v1/grades/${encodeURIComponent(grade.code)}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/grades/{code}',
    operationId: 'getGrade',
    summary: 'Get a grade (its latest version)',
    tag: 'Grades',
    access: { scope: 'grades:read' },
    params: GradeCodeParams,
    responses: { 200: { description: 'The grade.', schema: GradeSchema }, 404: { description: 'No such grade.' } },
    async handler({ params, ctx, reply }) {
      reply(200, await getGrade(ctx, params.code));
    },
  }),
  defineRoute({
    method: 'put',
    path: '/grades/{code}',
    operationId: 'updateGrade',
    summary: 'Replace a grade’s definition as a new version',
    description: `The earlier versions stay readable, and verdicts keep naming the version they used. ${CAUTION}`,
    tag: 'Grades',
    access: { scope: 'grades:write', labWide: true },
    params: GradeCodeParams,
    body: UpdateGradeRequestSchema,
    responses: {
      200: { description: 'The new version.', schema: GradeSchema },
      404: { description: 'No such grade.' },
      409: { description: 'Another version was added meanwhile.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await updateGrade(ctx, auth, params.code, body, req.requestId));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/grades/{code}/versions',
    operationId: 'listGradeVersions',
    summary: 'Every version of a grade, oldest first',
    tag: 'Grades',
    access: { scope: 'grades:read' },
    params: GradeCodeParams,
    responses: {
      200: { description: 'The versions.', schema: z.object({ data: z.array(GradeSchema) }) },
      404: { description: 'No such grade.' },
    },
    async handler({ params, ctx, reply }) {
      reply(200, { data: await getGradeVersions(ctx, params.code) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/grades/{code}/versions/{version}',
    operationId: 'getGradeVersion',
    summary: 'One version of a grade',
    tag: 'Grades',
    access: { scope: 'grades:read' },
    params: GradeVersionParams,
    responses: { 200: { description: 'That version.', schema: GradeSchema }, 404: { description: 'No such grade or version.' } },
    async handler({ params, ctx, reply }) {
      reply(200, await getGradeVersion(ctx, params.code, params.version));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/grades/{code}/evaluate',
    operationId: 'evaluateGrade',
    summary: 'Judge a composition against a grade',
    description:
      'Each limited element gets a verdict with the value as given, the value rounded to the limit’s place (rounding rule), the limits and the margin. A JSON number is read as its shortest decimal form (0.145 is 0.145). A qualified value decides only when every value it allows gives the same answer; otherwise it is `undetermined` and `conforms` is null, never true. Outside an aim is a warning, not a failure. ' +
      CAUTION,
    tag: 'Grades',
    access: { scope: 'grades:read' },
    params: GradeCodeParams,
    body: EvaluateRequestSchema,
    responses: { 200: { description: 'The evaluation.', schema: GradeEvaluationSchema }, 404: { description: 'No such grade.' } },
    async handler({ params, body, ctx, reply }) {
      reply(200, evaluateGrade(await getGrade(ctx, params.code), body.composition));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/grades/match',
    operationId: 'matchGrades',
    summary: 'Every grade a composition meets (regrading)',
    description:
      'Evaluates the composition against every grade of its matrix (given, or its largest element) and lists those it conforms to, the one with the largest smallest margin first — so a heat that missed its grade can be sold as another. ' +
      CAUTION,
    tag: 'Grades',
    access: { scope: 'grades:read' },
    body: MatchRequestSchema,
    responses: { 200: { description: 'The grades met.', schema: GradeMatchListSchema } },
    async handler({ body, ctx, reply }) {
      reply(200, await matchGrades(ctx, body.composition, body.matrix));
    },
  }),
];
