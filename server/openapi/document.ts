// Builds the OpenAPI 3.1 document from the route declarations and their zod schemas.
import { OpenAPIRegistry, OpenApiGeneratorV31, type ResponseConfig } from '@asteasolutions/zod-to-openapi';
import { APP_VERSION } from '../config.ts';
import { IDEMPOTENCY_HEADER, IDEMPOTENCY_KEY_MAX, REPLAYED_HEADER } from '../http/idempotency.ts';
import { type AnyRoute, isLabWide, requiredScope, WRITE_METHODS } from '../http/route.ts';
import { PROBLEM_CONTENT_TYPE } from '../lib/problems.ts';
import { ProblemSchema } from './problem.schemas.ts';
import { z } from '../lib/zod.ts';

const SESSION = 'sessionCookie';
const BEARER = 'apiKey';

function problemResponse(description: string): ResponseConfig {
  return { description, content: { [PROBLEM_CONTENT_TYPE]: { schema: ProblemSchema } } };
}

const IdempotencyKeyHeader = z
  .string()
  .min(1)
  .max(IDEMPOTENCY_KEY_MAX)
  .optional()
  .openapi({
    param: {
      description:
        `A unique key per logical write (e.g. a UUID), up to ${IDEMPOTENCY_KEY_MAX} characters. Retrying with the same key and the same request within 24 hours ` +
        `returns the first response again with \`${REPLAYED_HEADER}: true\` instead of repeating the write. Keys are kept per API key or user; anonymous calls are not deduplicated.`,
      example: '7f1c9a52-3b8e-4e5d-9a1f-0c2d4b6e8a10',
    },
  });

function headersFor(route: AnyRoute, status: number, headers: Record<string, string> = {}) {
  const all = { ...headers };
  if (WRITE_METHODS.has(route.method) && status < 300)
    all[REPLAYED_HEADER] = `\`true\` when this response is a replay for a repeated \`${IDEMPOTENCY_HEADER}\`.`;
  const entries = Object.entries(all);
  return entries.length
    ? { headers: Object.fromEntries(entries.map(([name, description]) => [name, { description, schema: { type: 'string' as const } }])) }
    : {};
}

function responsesFor(route: AnyRoute): Record<number, ResponseConfig> {
  const responses: Record<number, ResponseConfig> = {};
  for (const [status, spec] of Object.entries(route.responses)) {
    const contentType = spec.contentType ?? 'application/json';
    if (Number(status) >= 400 && !spec.schema) {
      responses[Number(status)] = problemResponse(spec.description);
      continue;
    }
    responses[Number(status)] = {
      description: spec.description,
      ...(spec.schema ? { content: { [contentType]: { schema: spec.schema } } } : {}),
      ...headersFor(route, Number(status), spec.headers),
    };
  }
  const add = (status: number, description: string) => {
    responses[status] ??= problemResponse(description);
  };
  const write = WRITE_METHODS.has(route.method);
  if (route.params || route.query || route.body || write) add(400, 'The request is not valid; `errors[]` names each field.');
  if (route.body || write) {
    add(413, 'The body is larger than the server accepts (`BODY_LIMIT`).');
    add(415, 'The body has a Content-Encoding other than gzip, deflate or br, or a charset other than UTF-8.');
  }
  if (write) {
    add(
      409,
      route.secretInResponse
        ? `A request with the same \`${IDEMPOTENCY_HEADER}\` is still being processed, or already succeeded: its response carried a secret that is shown once, so it is not replayed (\`resource\` names what was created).`
        : `A request with the same \`${IDEMPOTENCY_HEADER}\` is still being processed.`,
    );
    add(422, `The \`${IDEMPOTENCY_HEADER}\` was already used for a different request.`);
  }
  // Credentials are checked before any route, so even public operations refuse a bad API key.
  add(
    401,
    route.access === 'public'
      ? 'An Authorization header was sent with a malformed, unknown, revoked or expired API key.'
      : 'No valid session or API key.',
  );
  const forbidden = [
    requiredScope(route.access) && `The caller lacks the scope \`${requiredScope(route.access)}\`.`,
    isLabWide(route.access) && 'The caller is an API key restricted to instruments.',
    WRITE_METHODS.has(route.method) &&
      "Sent with the session cookie from another site (`Origin` not Meltwire's own, or `Sec-Fetch-Site: cross-site`/`same-site`).",
  ].filter(Boolean);
  if (forbidden.length > 0) add(403, forbidden.join(' Or: '));
  add(429, 'Rate limit exceeded; see `Retry-After`.');
  add(500, 'Unexpected server error.');
  return responses;
}

function describe(route: AnyRoute): string | undefined {
  const scope = requiredScope(route.access);
  const access =
    route.access === 'public'
      ? 'No authentication.'
      : scope
        ? `Requires the scope \`${scope}\`.${isLabWide(route.access) ? ' A lab-wide change: not open to API keys restricted to instruments.' : ''}`
        : 'Requires a signed-in user or an API key.';
  return [route.description, access].filter(Boolean).join('\n\n');
}

export function buildOpenApiDocument(routes: AnyRoute[]) {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', BEARER, {
    type: 'http',
    scheme: 'bearer',
    description: 'An API key issued by a lab admin, sent as `Authorization: Bearer mw_live_…`.',
  });
  registry.registerComponent('securitySchemes', SESSION, {
    type: 'apiKey',
    in: 'cookie',
    name: 'mw_session',
    description: "The console's session cookie, set by `POST /auth/login`.",
  });
  registry.register('Problem', ProblemSchema);

  for (const route of routes) {
    const scope = requiredScope(route.access);
    const roles = scope ? [scope] : [];
    registry.registerPath({
      method: route.method,
      path: route.path,
      operationId: route.operationId,
      summary: route.summary,
      description: describe(route),
      tags: [route.tag],
      ...(scope ? { 'x-required-scope': scope } : {}),
      ...(isLabWide(route.access) ? { 'x-lab-wide': true } : {}),
      security: route.access === 'public' ? [] : [{ [BEARER]: roles }, { [SESSION]: roles }],
      request: {
        ...(WRITE_METHODS.has(route.method) ? { headers: z.object({ [IDEMPOTENCY_HEADER]: IdempotencyKeyHeader }) } : {}),
        ...(route.params ? { params: route.params as z.ZodObject } : {}),
        ...(route.query ? { query: route.query as z.ZodObject } : {}),
        ...(route.body
          ? { body: { required: true, content: { [route.bodyContentType ?? 'application/json']: { schema: route.body } } } }
          : {}),
      },
      responses: responsesFor(route),
    });
  }

  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Meltwire API',
      version: APP_VERSION,
      description:
        'Ingests spark OES results, averages burns, applies drift correction, checks grades and serves every result with its raw burns and audit trail.\n\n' +
        'Errors are RFC 9457 `application/problem+json`. Lists use cursor pagination (`{ data, next_cursor }`). Timestamps are ISO 8601 UTC.\n\n' +
        "**Caution:** released results decide whether a heat ships. Review and authorise results under your laboratory's own accredited procedures.",
    },
    servers: [{ url: '/api/v1', description: 'This server' }],
    tags: [],
  });
}
