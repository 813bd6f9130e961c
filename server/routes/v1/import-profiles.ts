import { actorOf } from '../../domain/audit/actor.ts';
import {
  AUTO_DETECTION_DESCRIPTION,
  CreateImportProfileRequestSchema,
  ImportProfileIdParams,
  ImportProfileListQuerySchema,
  ImportProfileListSchema,
  ImportProfileSchema,
  UpdateImportProfileRequestSchema,
} from '../../domain/imports/import-profiles.schemas.ts';
import {
  createImportProfile,
  getImportProfile,
  listImportProfilesPage,
  updateImportProfile,
} from '../../domain/imports/import-profiles.service.ts';
import { defineRoute } from '../../http/route.ts';

export const importProfileRoutes = [
  defineRoute({
    method: 'get',
    path: '/import-profiles',
    operationId: 'listImportProfiles',
    summary: 'List import profiles',
    description: 'Oldest first.',
    tag: 'Import profiles',
    access: { scope: 'samples:read' },
    query: ImportProfileListQuerySchema,
    responses: { 200: { description: 'A page of profiles.', schema: ImportProfileListSchema } },
    async handler({ query, ctx, reply }) {
      reply(200, await listImportProfilesPage(ctx, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/import-profiles',
    operationId: 'createImportProfile',
    summary: 'Describe how to read a family of result files',
    description: `Every field but \`name\` has a default; an empty profile detects everything. ${AUTO_DETECTION_DESCRIPTION}`,
    tag: 'Import profiles',
    access: { scope: 'imports:write', labWide: true },
    body: CreateImportProfileRequestSchema,
    responses: {
      201: { description: 'Created.', schema: ImportProfileSchema, headers: { Location: 'The new profile.' } },
      409: { description: 'A profile with this name exists (names are compared ignoring case).' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const profile = await createImportProfile(ctx, body, { actor: actorOf(auth), userId: auth.userId, requestId: req.requestId });
      reply(201, profile, { Location: `/api/v1/import-profiles/${profile.id}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/import-profiles/{id}',
    operationId: 'getImportProfile',
    summary: 'Get an import profile',
    tag: 'Import profiles',
    access: { scope: 'samples:read' },
    params: ImportProfileIdParams,
    responses: { 200: { description: 'The profile.', schema: ImportProfileSchema }, 404: { description: 'No such profile.' } },
    async handler({ params, ctx, reply }) {
      reply(200, await getImportProfile(ctx, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/import-profiles/{id}',
    operationId: 'updateImportProfile',
    summary: 'Change an import profile',
    description:
      'Top-level fields replace the stored ones (`columns` is replaced whole); the changed profile is validated as a whole and its `revision` goes up by one.',
    tag: 'Import profiles',
    access: { scope: 'imports:write', labWide: true },
    params: ImportProfileIdParams,
    body: UpdateImportProfileRequestSchema,
    responses: {
      200: { description: 'The changed profile.', schema: ImportProfileSchema },
      404: { description: 'No such profile.' },
      409: { description: 'Another profile has this name.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await updateImportProfile(ctx, params.id, body, { actor: actorOf(auth), userId: auth.userId, requestId: req.requestId }));
    },
  }),
];
