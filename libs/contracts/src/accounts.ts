import { z } from 'zod';
import { roleSchema } from './roles';

/** Request and answer shapes of sign-in, the session, invitations, password resets and user admin. */

export const MIN_PASSWORD_LENGTH = 12;
export const MAX_PASSWORD_LENGTH = 256;

export const emailSchema = z
  .string({ error: 'email must be a string' })
  .trim()
  .toLowerCase()
  .max(254, 'email must be at most 254 characters')
  .pipe(z.email({ error: 'email must be an e-mail address' }));

const password = z.string({ error: 'password must be a string' }).max(MAX_PASSWORD_LENGTH, `password must be at most ${MAX_PASSWORD_LENGTH} characters`);
export const newPasswordSchema = password.min(MIN_PASSWORD_LENGTH, `password must be at least ${MIN_PASSWORD_LENGTH} characters`);
export const personNameSchema = z.string({ error: 'name must be a string' }).trim().min(1, 'name must not be empty').max(120, 'name must be at most 120 characters');

export const signInBodySchema = z.strictObject({ email: emailSchema, password: password.min(1, 'password must not be empty') });
export type SignInBody = z.infer<typeof signInBodySchema>;

/** `GET /api/me` and the answer to sign-in. */
export const currentUserSchema = z.object({ id: z.string(), email: z.string(), name: z.string(), role: roleSchema });
export type CurrentUser = z.infer<typeof currentUserSchema>;

export const changePasswordBodySchema = z.strictObject({ currentPassword: password, newPassword: newPasswordSchema });

/** `POST /api/admin/invitations` (admin): who to invite and with which role. */
export const invitationBodySchema = z.strictObject({ email: emailSchema, role: roleSchema });
/** `POST /api/auth/invitations/:token/accept`: the invited person sets their name and password. */
export const acceptInvitationBodySchema = z.strictObject({ name: personNameSchema, password: newPasswordSchema });
/** `POST /api/auth/password-reset`: ask for a reset link (answered the same whether or not the address is known). */
export const passwordResetRequestBodySchema = z.strictObject({ email: emailSchema });
/** `POST /api/auth/password-reset/:token`: set a new password with the link's token. */
export const passwordResetBodySchema = z.strictObject({ password: newPasswordSchema });

/** A user as the admin pages list them. */
export interface UserSummary {
  id: string;
  email: string;
  name: string;
  role: z.infer<typeof roleSchema>;
  active: boolean;
  createdAt: string;
}
/** `PATCH /api/admin/users/:id` (admin). */
export const userUpdateBodySchema = z.strictObject({ role: roleSchema.optional(), active: z.boolean().optional() });

export interface InvitationSummary {
  id: string;
  email: string;
  role: z.infer<typeof roleSchema>;
  invitedBy: string;
  createdAt: string;
  expiresAt: string;
  acceptedAt: string | null;
}

export interface AuditEvent {
  id: string;
  at: string;
  actor: string | null;
  action: string;
  subject: string;
  detail: string;
}

export interface OutboxMessage {
  to: string;
  subject: string;
  text: string;
  sentAt: string;
}

/** `?page&pageSize` of the admin lists (users, audit log): pages count from 1. */
export const adminPageQuerySchema = z.strictObject({
  page: z.coerce.number({ error: 'page must be a number' }).int('page must be a whole number').min(1, 'page must be at least 1').default(1),
  pageSize: z.coerce.number({ error: 'pageSize must be a number' }).int('pageSize must be a whole number').min(1, 'pageSize must be at least 1').max(200, 'pageSize must be at most 200').default(50),
});
export type AdminPageQuery = z.infer<typeof adminPageQuerySchema>;

/** Every list answer of the API. */
export interface Page<T> {
  items: T[];
  total: number;
}
