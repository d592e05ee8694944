import { z } from 'zod';
import { ROLES } from '../permissions';

export const RoleSchema = z.enum(ROLES);

/** GET /api/auth/me */
export const MeSchema = z.object({
  user: z.object({ id: z.number(), email: z.string(), name: z.string() }),
  organisations: z.array(z.object({ id: z.number(), name: z.string(), role: RoleSchema })),
  current: z.object({ id: z.number(), name: z.string(), role: RoleSchema }).nullable(),
});
export type Me = z.infer<typeof MeSchema>;

export const PASSWORD_MIN_LENGTH = 10;
export const EmailSchema = z.string().trim().toLowerCase().email('Enter an e-mail address such as name@example.org').max(254);

export const SignInSchema = z.object({
  email: EmailSchema,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignIn = z.infer<typeof SignInSchema>;

/** Length and the common-password list are checked on the server too (server/services/passwords.ts). */
export const NewPasswordSchema = z.string().min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`).max(200, 'Use at most 200 characters');

export const SignUpSchema = z.object({
  email: EmailSchema,
  password: NewPasswordSchema,
  name: z.string().trim().min(1, 'Enter your name').max(120),
  organisationName: z.string().trim().min(2, 'Enter the organisation name (2 characters or more)').max(120),
});
export type SignUp = z.infer<typeof SignUpSchema>;

/** POST /api/auth/password */
export const ChangePasswordSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword: NewPasswordSchema,
});
export type ChangePassword = z.infer<typeof ChangePasswordSchema>;

/** PATCH /api/auth/me */
export const ProfileSchema = z.object({ name: z.string().trim().min(1, 'Enter your name').max(120) });
export type Profile = z.infer<typeof ProfileSchema>;

/** POST /api/auth/switch */
export const SwitchSchema = z.object({ organisationId: z.coerce.number().int().positive() });

/** POST /api/auth/reset/request — always answered 202. */
export const ResetRequestSchema = z.object({ email: EmailSchema });
export type ResetRequest = z.infer<typeof ResetRequestSchema>;

/** One-time tokens in links are base64url, 43 characters (32 random bytes). */
export const LinkTokenSchema = z.string().trim().min(20, 'This link is incomplete; open it again from the e-mail').max(200);

/** POST /api/auth/reset/confirm */
export const ResetConfirmSchema = z.object({ token: LinkTokenSchema, password: NewPasswordSchema });
export type ResetConfirm = z.infer<typeof ResetConfirmSchema>;

/** Roles an invitation may carry (ownership is handed over by transfer, not by invitation). */
export const InvitableRoleSchema = z.enum(['admin', 'analyst', 'dispatcher', 'viewer']);

/** POST /api/invitations */
export const InviteSchema = z.object({ email: EmailSchema, role: InvitableRoleSchema });
export type Invite = z.infer<typeof InviteSchema>;

/**
 * POST /api/invitations/accept: a signed-in user sends only the token; a visitor with an existing
 * account adds its password; a new visitor adds name and a new password.
 */
export const AcceptInvitationSchema = z.object({
  token: LinkTokenSchema,
  name: z.string().trim().min(1, 'Enter your name').max(120).optional(),
  password: z.string().min(1, 'Enter a password').max(200).optional(),
});
export type AcceptInvitation = z.infer<typeof AcceptInvitationSchema>;

/** GET /api/invitations/lookup?token= — what the invite page shows before accepting. */
export const InvitationPreviewSchema = z.object({
  organisationName: z.string(),
  email: z.string(),
  role: RoleSchema,
  invitedBy: z.string().nullable(),
  accountExists: z.boolean(),
  expiresAt: z.string(),
});
export type InvitationPreview = z.infer<typeof InvitationPreviewSchema>;

/** GET /api/invitations (pending only) */
export const InvitationSchema = z.object({
  id: z.number(),
  email: z.string(),
  role: RoleSchema,
  invitedBy: z.string().nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
  expired: z.boolean(),
});
export type Invitation = z.infer<typeof InvitationSchema>;

/** GET /api/members — `id` is the membership id used by PATCH/DELETE /api/members/:id. */
export const MemberSchema = z.object({
  id: z.number(),
  userId: z.number(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof MemberSchema>;

export const MembersAnswerSchema = z.object({
  members: z.array(MemberSchema),
  seats: z.object({ used: z.number(), limit: z.number(), plan: z.string(), planLabel: z.string() }),
});
export type MembersAnswer = z.infer<typeof MembersAnswerSchema>;

/** PATCH /api/members/:id */
export const ChangeRoleSchema = z.object({ role: RoleSchema });

export const IdParamsSchema = z.object({ id: z.coerce.number().int().positive('Use a numeric id') });

/** POST /api/organisation/transfer */
export const TransferSchema = z.object({ userId: z.coerce.number().int().positive() });
/** DELETE /api/organisation — the typed organisation name confirms the closing. */
export const CloseOrganisationSchema = z.object({ confirmName: z.string().min(1, 'Type the organisation name to confirm') });

/** GET /api/audit */
export const AuditQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export const AuditEventSchema = z.object({
  id: z.number(),
  action: z.string(),
  actor: z.object({ id: z.number(), name: z.string(), email: z.string() }).nullable(),
  /** The person an event is about (targetType 'user'), when known: the log says who. */
  target: z.object({ id: z.number(), name: z.string(), email: z.string() }).nullable().optional(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  detail: z.record(z.string(), z.unknown()).nullable(),
  ip: z.string().nullable(),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof AuditEventSchema>;
export const AuditPageSchema = z.object({ items: z.array(AuditEventSchema), page: z.number(), pageSize: z.number(), total: z.number() });
export type AuditPage = z.infer<typeof AuditPageSchema>;

/** POST /api/tokens → 201 {id, token, …}; the token is shown once. */
export const CreateTokenSchema = z.object({ name: z.string().trim().min(1, 'Name the token (e.g. the dispatch system it is for)').max(80) });
export type CreateToken = z.infer<typeof CreateTokenSchema>;
export const ApiTokenSchema = z.object({
  id: z.number(),
  name: z.string(),
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
});
export type ApiToken = z.infer<typeof ApiTokenSchema>;
export type CreatedToken = ApiToken & { token: string };
