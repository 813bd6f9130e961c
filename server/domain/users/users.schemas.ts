import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { ROLES, SCOPES } from '../auth/scopes.ts';

const RoleSchema = z.enum(ROLES).openapi('Role');
export const ScopeSchema = z.enum(SCOPES).openapi('Scope');
const UserStatusSchema = z.enum(['invited', 'active', 'disabled']).openapi('UserStatus');

const email = z.email('must be an e-mail address').max(320).openapi({ example: 'ada@kestrelbend.test' });

/** bcrypt reads at most 72 bytes; refusing longer passwords is more honest than truncating them. */
export const PasswordSchema = z
  .string()
  .min(10, 'must be at least 10 characters')
  .refine((value) => Buffer.byteLength(value, 'utf8') <= 72, 'must be at most 72 bytes');

export const UserSchema = z
  .object({
    id: z.string().openapi({ example: 'usr_01jd9x4ck3m9y1n0qg7f2h6v5w' }),
    email: z.string(),
    name: z.string(),
    role: RoleSchema,
    status: UserStatusSchema,
    created_at: z.string().openapi({ format: 'date-time' }),
    updated_at: z.string().openapi({ format: 'date-time' }),
    last_login_at: z.string().nullable().openapi({ format: 'date-time' }),
  })
  .openapi('User');

export const UserListSchema = listOf(UserSchema, 'UserList');

export const UserListQuerySchema = paginationQuery.extend({
  role: RoleSchema.optional(),
  status: UserStatusSchema.optional(),
});

export const UserIdParams = z.object({ id: z.string().min(1).max(40) });

export const MailOutcomeSchema = z
  .object({
    delivered: z.boolean(),
    error: z.string().optional(),
  })
  .openapi('MailOutcome', { description: 'Whether the e-mail was handed to the SMTP server.' });

export const InviteUserRequestSchema = z
  .object({
    email,
    name: z.string().trim().min(1).max(200),
    role: RoleSchema,
  })
  .openapi('InviteUserRequest');

export const InvitedUserSchema = z.object({ user: UserSchema, invitation_mail: MailOutcomeSchema }).openapi('InvitedUser');

export const UpdateUserRequestSchema = z
  .object({
    name: z.string().trim().min(1).max(200).optional(),
    role: RoleSchema.optional(),
    status: z.enum(['active', 'disabled']).optional().openapi({ description: 'Disable to block sign-in; re-enable to restore it.' }),
  })
  .refine((value) => Object.keys(value).length > 0, 'give at least one of name, role, status')
  .openapi('UpdateUserRequest');

export const LoginRequestSchema = z.object({ email: z.string().max(320), password: z.string().max(1000) }).openapi('LoginRequest');

export const MeSchema = z
  .object({
    user: UserSchema,
    scopes: z.array(ScopeSchema),
    auth: z.enum(['session', 'api_key']),
    session_expires_at: z.string().nullable().openapi({ format: 'date-time' }),
  })
  .openapi('Me');

export const AcceptInvitationRequestSchema = z
  .object({ token: z.string().min(10).max(200), password: PasswordSchema })
  .openapi('AcceptInvitationRequest');

export const PasswordResetRequestSchema = z.object({ email }).openapi('PasswordResetRequest');

export const PasswordResetConfirmSchema = z
  .object({ token: z.string().min(10).max(200), password: PasswordSchema })
  .openapi('PasswordResetConfirm');
