// One declaration per operation: path, access (scope), request schemas, responses and handler.
// mountRoutes() turns the declarations into Express routes; registerOpenApi() documents them.
// Because both read the same object, no route can be served without its scope or its docs.
import type { Request, RequestHandler, Response, Router } from 'express';
import type { z, ZodType } from 'zod';
import type { AppContext } from '../context.ts';
import type { Scope } from '../domain/auth/scopes.ts';
import { idempotency } from './idempotency.ts';
import { PreparedJson } from '../lib/prepared-json.ts';
import { sendPreparedJson } from './prepared-json.ts';
import { ForbiddenProblem, UnauthorizedProblem } from '../lib/problems.ts';
import { parseOrProblem } from '../lib/readable-issues.ts';
import type { AuthContext } from '../domain/auth/auth-context.ts';

/**
 * Who may call an operation. `labWide`: it changes what every instrument shares (instruments,
 * methods, profiles, reference materials, users), so an API key restricted to instruments may not.
 */
export type Access = { scope: Scope; labWide?: true } | 'public' | 'signed-in';

export interface ResponseSpec {
  description: string;
  schema?: ZodType;
  /** Defaults to application/json when a schema is given. */
  contentType?: string;
  headers?: Record<string, string>;
}

type Responses = Record<number, ResponseSpec>;

/** The JSON body a declared response takes: what its schema accepts. */
type ReplyBody<R extends ResponseSpec> = R extends { schema: infer S extends ZodType } ? z.input<S> : never;

export interface HandlerInput<P, Q, B, R extends Responses = Responses> {
  params: P;
  query: Q;
  body: B;
  /**
   * Answers with one of the route's declared JSON responses: a body that disagrees with that
   * status's schema is a compile error. Non-JSON answers (CSV, files) use `res` directly.
   */
  reply<S extends keyof R & number>(
    status: S,
    body: ReplyBody<R[S]> | PreparedJson<ReplyBody<R[S]>>,
    headers?: Record<string, string>,
  ): void;
  /** The caller; throws 401 when read on a public route without credentials. */
  readonly auth: AuthContext;
  req: Request;
  res: Response;
  ctx: AppContext;
}

export interface RouteSpec<
  P extends ZodType = ZodType,
  Q extends ZodType = ZodType,
  B extends ZodType = ZodType,
  R extends Responses = Responses,
> {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** OpenAPI-style path below /api/v1, e.g. /users/{id} */
  path: string;
  operationId: string;
  summary: string;
  description?: string;
  tag: string;
  access: Access;
  params?: P;
  query?: Q;
  body?: B;
  bodyContentType?: string;
  /** Middleware run after authorization and before parsing (uploads, route-specific limits). */
  before?: (ctx: AppContext) => RequestHandler[];
  /**
   * The success response carries a secret shown once (a new API key). An Idempotency-Key retry
   * then gets a 409 naming the resource instead of a replay, so the secret is never stored.
   */
  secretInResponse?: boolean;
  responses: R;
  handler(input: HandlerInput<ZodOutput<P>, ZodOutput<Q>, ZodOutput<B>, R>): Promise<void> | void;
}

type ZodOutput<T> = T extends ZodType<infer O> ? O : undefined;

export type AnyRoute = RouteSpec<ZodType, ZodType, ZodType>;

/** Identity helper that lets TypeScript infer the handler's input types from the schemas. */
export function defineRoute<P extends ZodType, Q extends ZodType, B extends ZodType, R extends Responses>(
  spec: RouteSpec<P, Q, B, R>,
): AnyRoute {
  return spec as unknown as AnyRoute;
}

/** Methods that accept Idempotency-Key. */
export const WRITE_METHODS: ReadonlySet<RouteSpec['method']> = new Set(['post', 'put', 'patch', 'delete']);

function toExpressPath(path: string): string {
  return path.replace(/\{(\w+)\}/g, ':$1');
}

export function requiredScope(access: Access): Scope | undefined {
  return typeof access === 'object' ? access.scope : undefined;
}

export function isLabWide(access: Access): boolean {
  return typeof access === 'object' && access.labWide === true;
}

function authorize(access: Access, req: Request): void {
  if (access === 'public') return;
  if (!req.auth) throw new UnauthorizedProblem();
  const scope = requiredScope(access);
  if (scope && !req.auth.scopes.has(scope)) {
    throw new ForbiddenProblem(`This action needs the scope "${scope}".`, { required_scope: scope });
  }
  if (isLabWide(access) && req.auth.instrumentIds) {
    throw new ForbiddenProblem('This API key is restricted to some instruments; lab-wide settings need a key without that restriction.', {
      restricted_to_instruments: req.auth.instrumentIds,
    });
  }
}

function parsePart(part: 'params' | 'query' | 'body', schema: ZodType | undefined, value: unknown): unknown {
  if (!schema) return undefined;
  return parseOrProblem(part, schema, value ?? (part === 'body' ? undefined : {}));
}

export function mountRoutes(router: Router, routes: AnyRoute[], ctx: AppContext): void {
  for (const spec of routes) {
    const guard: RequestHandler = (req, _res, next) => {
      authorize(spec.access, req);
      next();
    };
    const run: RequestHandler = async (req, res) => {
      const params = parsePart('params', spec.params, req.params);
      const query = parsePart('query', spec.query, req.query);
      const body = parsePart('body', spec.body, req.body);
      await spec.handler({
        params,
        query,
        body,
        req,
        res,
        ctx,
        reply(status, payload, headers) {
          if (headers) res.set(headers);
          res.status(status);
          if (payload instanceof PreparedJson) sendPreparedJson(res, payload, ctx.checksResponses === true);
          else res.json(payload);
        },
        get auth(): AuthContext {
          if (!req.auth) throw new UnauthorizedProblem();
          return req.auth;
        },
      });
    };
    // Idempotency comes after `before` so that files parsed there are part of the fingerprint.
    const dedupe = WRITE_METHODS.has(spec.method) ? [idempotency(ctx, { secretInResponse: spec.secretInResponse })] : [];
    router[spec.method](toExpressPath(spec.path), guard, ...(spec.before?.(ctx) ?? []), ...dedupe, run);
  }
}
