import type { AnyRoute } from '../../http/route.ts';
import { alertPreferenceRoutes } from './alert-preferences.ts';
import { apiKeyRoutes } from './api-keys.ts';
import { controlSampleRoutes } from './control-samples.ts';
import { auditRoutes } from './audit-events.ts';
import { authRoutes } from './auth.ts';
import { driftRoutes } from './drift.ts';
import { gradeRoutes } from './grades.ts';
import { eventRoutes } from './events.ts';
import { feedRoutes } from './feeds.ts';
import { healthRoutes } from './health.ts';
import { importProfileRoutes } from './import-profiles.ts';
import { importRoutes } from './imports.ts';
import { instrumentRoutes } from './instruments.ts';
import { methodRoutes } from './methods.ts';
import { openApiRoute } from './openapi.ts';
import { outboxRoutes } from './outbox.ts';
import { referenceMaterialRoutes } from './reference-materials.ts';
import { requestLogRoutes } from './request-log.ts';
import { sampleRecomputeRoutes } from './sample-recompute.ts';
import { sampleReleaseRoutes } from './sample-release.ts';
import { sampleRoutes } from './samples.ts';
import { sampleFieldRoutes } from './sample-fields.ts';
import { standardizationRoutes } from './standardizations.ts';
import { userRoutes } from './users.ts';
import { webhookDeliveryRoutes } from './webhook-deliveries.ts';
import { webhookEndpointRoutes } from './webhook-endpoints.ts';

/** Every /api/v1 operation. The OpenAPI document and the Express router are both built from this list. */
export const v1Routes: AnyRoute[] = [
  ...healthRoutes,
  openApiRoute(() => v1Routes),
  ...authRoutes,
  ...userRoutes,
  ...apiKeyRoutes,
  ...instrumentRoutes,
  ...feedRoutes,
  ...methodRoutes,
  ...sampleRoutes,
  ...sampleRecomputeRoutes,
  ...sampleReleaseRoutes,
  ...sampleFieldRoutes,
  ...importProfileRoutes,
  ...importRoutes,
  ...referenceMaterialRoutes,
  ...standardizationRoutes,
  ...driftRoutes,
  ...gradeRoutes,
  ...controlSampleRoutes,
  ...alertPreferenceRoutes,
  ...eventRoutes,
  ...webhookEndpointRoutes,
  ...webhookDeliveryRoutes,
  ...auditRoutes,
  ...requestLogRoutes,
  ...outboxRoutes,
];
