import { login, logout } from '../../domain/auth/auth.service.ts';
import { ROLE_SCOPES } from '../../domain/auth/scopes.ts';
import {
  AcceptInvitationRequestSchema,
  LoginRequestSchema,
  MeSchema,
  PasswordResetConfirmSchema,
  PasswordResetRequestSchema,
  UserSchema,
} from '../../domain/users/users.schemas.ts';
import { acceptInvitation, confirmPasswordReset, getCaller, requestPasswordReset } from '../../domain/users/users.service.ts';
import { credentialLimiter } from '../../http/rate-limit.ts';
import { defineRoute } from '../../http/route.ts';
import { clearSessionCookie, setSessionCookie } from '../../http/session-cookie.ts';

export const authRoutes = [
  defineRoute({
    method: 'post',
    path: '/auth/login',
    operationId: 'login',
    summary: 'Sign in with e-mail and password',
    description:
      'Sets the httpOnly session cookie `mw_session` (a signed token renewed while in use). The same 401 answers an unknown e-mail, a wrong password and a disabled account.',
    tag: 'Auth',
    access: 'public',
    body: LoginRequestSchema,
    before: credentialLimiter,
    responses: {
      200: { description: 'Signed in.', schema: MeSchema },
      401: { description: 'The e-mail or password is not correct, or the account is disabled.' },
    },
    async handler({ body, req, res, ctx, reply }) {
      const { sessionId, user } = await login(ctx, { ...body, ip: req.ip, userAgent: req.get('user-agent'), requestId: req.requestId });
      const expiresAt = setSessionCookie(res, ctx.config, sessionId, user.id);
      reply(200, { user, scopes: [...ROLE_SCOPES[user.role]], auth: 'session', session_expires_at: expiresAt });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/logout',
    operationId: 'logout',
    summary: 'Sign out and end the session',
    tag: 'Auth',
    access: 'public',
    responses: { 204: { description: 'Signed out (also when there was no session).' } },
    async handler({ req, res, ctx }) {
      if (req.auth?.kind === 'session') await logout(ctx, req.auth, req.requestId);
      clearSessionCookie(res, ctx.config);
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'get',
    path: '/auth/me',
    operationId: 'getMe',
    summary: "The signed-in user (or the API key's owner) and the scopes in effect",
    tag: 'Auth',
    access: 'signed-in',
    responses: { 200: { description: 'The caller.', schema: MeSchema } },
    async handler({ auth, res, ctx, reply }) {
      reply(200, {
        user: await getCaller(ctx, auth),
        scopes: [...auth.scopes],
        auth: auth.kind,
        session_expires_at: auth.kind === 'session' ? (res.locals.sessionExpiresAt as string) : null,
      });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/accept-invitation',
    operationId: 'acceptInvitation',
    summary: 'Activate an invited account by choosing a password',
    tag: 'Auth',
    access: 'public',
    body: AcceptInvitationRequestSchema,
    before: credentialLimiter,
    responses: {
      200: { description: 'The account is active; sign in with the new password.', schema: UserSchema },
      422: { description: 'The invitation is unknown, used or expired.' },
    },
    async handler({ body, req, ctx, reply }) {
      reply(200, await acceptInvitation(ctx, body.token, body.password, req.requestId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/password-reset',
    operationId: 'requestPasswordReset',
    summary: 'E-mail a password-reset link',
    description: 'Answers 202 whether or not the e-mail belongs to an account, so it cannot be used to find accounts.',
    tag: 'Auth',
    access: 'public',
    body: PasswordResetRequestSchema,
    before: credentialLimiter,
    responses: { 202: { description: 'If the account exists and is active, a link is on its way.' } },
    async handler({ body, req, res, ctx }) {
      await requestPasswordReset(ctx, body.email, req.requestId);
      res.status(202).end();
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/password-reset/confirm',
    operationId: 'confirmPasswordReset',
    summary: "Set a new password with a reset link's token",
    description: 'Ends every session of the account.',
    tag: 'Auth',
    access: 'public',
    body: PasswordResetConfirmSchema,
    before: credentialLimiter,
    responses: {
      204: { description: 'The password is changed.' },
      422: { description: 'The token is unknown, used or expired.' },
    },
    async handler({ body, req, res, ctx }) {
      await confirmPasswordReset(ctx, body.token, body.password, req.requestId);
      res.status(204).end();
    },
  }),
];
