import type { AnyRoute } from '../../http/route.ts';
import { apiKeyRoutes } from './api-keys.ts';
import { auditRoutes } from './audit-events.ts';
import { authRoutes } from './auth.ts';
import { healthRoutes } from './health.ts';
import { importProfileRoutes } from './import-profiles.ts';
import { importRoutes } from './imports.ts';
import { instrumentRoutes } from './instruments.ts';
import { methodRoutes } from './methods.ts';
import { openApiRoutes } from './openapi.ts';
import { outboxRoutes } from './outbox.ts';
import { requestLogRoutes } from './request-log.ts';
import { sampleRoutes } from './samples.ts';
import { userRoutes } from './users.ts';

/** Every /api/v1 operation. The OpenAPI document and the Express router are both built from this list. */
export const v1Routes: AnyRoute[] = [
  ...healthRoutes,
  ...openApiRoutes,
  ...authRoutes,
  ...userRoutes,
  ...apiKeyRoutes,
  ...instrumentRoutes,
  ...methodRoutes,
  ...sampleRoutes,
  ...importProfileRoutes,
  ...importRoutes,
  ...auditRoutes,
  ...requestLogRoutes,
  ...outboxRoutes,
];
