import { z } from '../../lib/zod.ts';
import { ALERT_KINDS, type AlertKind } from './alerts.service.ts';

const AlertKindSchema = z
  .enum(Object.keys(ALERT_KINDS) as [AlertKind, ...AlertKind[]])
  .openapi('AlertKind', { description: 'What e-mails you.', 'x-enum-descriptions': ALERT_KINDS });

const PreferenceSchema = z
  .object({
    kind: AlertKindSchema,
    instrument_id: z.string().max(40).nullable().openapi({ description: 'Only this instrument; null for all instruments.' }),
  })
  .openapi('AlertPreference');

export const AlertPreferencesSchema = z
  .object({
    data: z.array(PreferenceSchema),
    group_minutes: z.number().openapi({ description: 'Alerts within this many minutes come as one message.' }),
  })
  .openapi('AlertPreferences');

export const PutAlertPreferencesRequestSchema = z
  .object({ data: z.array(PreferenceSchema).max(200) })
  .openapi('PutAlertPreferencesRequest');
