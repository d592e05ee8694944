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
