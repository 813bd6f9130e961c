import { actorOf } from '../../domain/audit/actor.ts';
import {
  InvitedUserSchema,
  InviteUserRequestSchema,
  MailOutcomeSchema,
  UpdateUserRequestSchema,
  UserIdParams,
  UserListQuerySchema,
  UserListSchema,
  UserSchema,
} from '../../domain/users/users.schemas.ts';
import { getUser, inviteUser, listUsersPage, resendInvitation, updateUser } from '../../domain/users/users.service.ts';
import { defineRoute } from '../../http/route.ts';

export const userRoutes = [
  defineRoute({
    method: 'get',
    path: '/users',
    operationId: 'listUsers',
    summary: 'List users',
    tag: 'Users',
    access: { scope: 'users:read' },
    query: UserListQuerySchema,
    responses: { 200: { description: 'A page of users.', schema: UserListSchema } },
    async handler({ query, ctx, reply }) {
      reply(200, await listUsersPage(ctx, query));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/users',
    operationId: 'inviteUser',
    summary: 'Invite a user by e-mail',
    description:
      'Creates the user with status `invited` and e-mails a link to choose a password (valid 7 days). `invitation_mail.delivered` says whether the SMTP server took the message.',
    tag: 'Users',
    access: { scope: 'users:write', labWide: true },
    body: InviteUserRequestSchema,
    responses: {
      201: { description: 'Invited.', schema: InvitedUserSchema, headers: { Location: 'The new user.' } },
      409: { description: 'A user with this e-mail exists (e-mails are compared ignoring case).' },
    },
    async handler({ body, auth, req, ctx, reply }) {
      const result = await inviteUser(ctx, body, { actor: actorOf(auth), requestId: req.requestId });
      reply(201, result, { Location: `/api/v1/users/${result.user.id}` });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/users/{id}',
    operationId: 'getUser',
    summary: 'Get a user',
    tag: 'Users',
    access: { scope: 'users:read' },
    params: UserIdParams,
    responses: { 200: { description: 'The user.', schema: UserSchema }, 404: { description: 'No such user.' } },
    async handler({ params, ctx, reply }) {
      reply(200, await getUser(ctx, params.id));
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/users/{id}',
    operationId: 'updateUser',
    summary: "Change a user's name, role or status",
    description: 'Changing the role or disabling the user ends their sessions. The last active admin cannot be demoted or disabled (409).',
    tag: 'Users',
    access: { scope: 'users:write', labWide: true },
    params: UserIdParams,
    body: UpdateUserRequestSchema,
    responses: {
      200: { description: 'The updated user.', schema: UserSchema },
      404: { description: 'No such user.' },
      409: { description: 'The change would leave no active admin, or the user has not accepted the invitation.' },
    },
    async handler({ params, body, auth, req, ctx, reply }) {
      reply(200, await updateUser(ctx, params.id, body, { actor: actorOf(auth), requestId: req.requestId }));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/users/{id}/invitation',
    operationId: 'resendInvitation',
    summary: 'Send a new invitation e-mail',
    description: 'Replaces any earlier invitation link of this user.',
    tag: 'Users',
    access: { scope: 'users:write', labWide: true },
    params: UserIdParams,
    responses: {
      202: { description: 'Sent (see `delivered`).', schema: MailOutcomeSchema },
      404: { description: 'No such user.' },
      409: { description: 'The user has already accepted.' },
    },
    async handler({ params, auth, req, ctx, reply }) {
      reply(202, await resendInvitation(ctx, params.id, { actor: actorOf(auth), requestId: req.requestId }));
    },
  }),
];
