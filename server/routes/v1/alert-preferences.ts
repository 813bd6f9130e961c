import { AlertPreferencesSchema, PutAlertPreferencesRequestSchema } from '../../domain/alerts/alerts.schemas.ts';
import { getAlertPreferences, setAlertPreferences } from '../../domain/alerts/alerts.service.ts';
import { defineRoute } from '../../http/route.ts';

export const alertPreferenceRoutes = [
  defineRoute({
    method: 'get',
    path: '/me/alert-preferences',
    operationId: 'getAlertPreferences',
    summary: 'Which events e-mail me',
    tag: 'Alerts',
    access: 'signed-in',
    responses: { 200: { description: 'Your alert choices.', schema: AlertPreferencesSchema } },
    async handler({ auth, ctx, reply }) {
      reply(200, await getAlertPreferences(ctx, auth));
    },
  }),
  defineRoute({
    method: 'put',
    path: '/me/alert-preferences',
    operationId: 'putAlertPreferences',
    summary: 'Choose which events e-mail me',
    description: 'Replaces your choices. Alerts within `group_minutes` of each other arrive as one message.',
    tag: 'Alerts',
    access: 'signed-in',
    body: PutAlertPreferencesRequestSchema,
    responses: { 200: { description: 'Your alert choices.', schema: AlertPreferencesSchema }, 422: { description: 'Unknown instrument.' } },
    async handler({ auth, body, ctx, reply }) {
      reply(200, await setAlertPreferences(ctx, auth, body));
    },
  }),
];
