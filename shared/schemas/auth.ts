import { z } from 'zod';
import { AREA_UNITS, HomeAreaSchema, LENGTH_UNITS } from './firm';
import { RecordIdSchema } from './common';
import { LIMITS } from '../limits';

export const ROLES = ['owner', 'consultant', 'crew', 'client'] as const;
export type Role = (typeof ROLES)[number];
export const STAFF_ROLES: readonly Role[] = ['owner', 'consultant'];

const email = z.string().trim().toLowerCase().max(LIMITS.emailMax).email({ message: 'enter an e-mail address like name@example.com' });
const password = z
  .string()
  .min(LIMITS.passwordMin, { message: `use at least ${LIMITS.passwordMin} characters` })
  .max(LIMITS.passwordMax, { message: `use at most ${LIMITS.passwordMax} characters` });

export const LoginSchema = z.object({
  email,
  password: z.string().min(1, { message: 'enter your password' }).max(LIMITS.passwordMax),
});
export type LoginInput = z.infer<typeof LoginSchema>;

/** The signed-in user as every auth answer shows it. */
export const SessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  firmId: z.number().int(),
  firmName: z.string(),
  /** The firm's IANA time zone: "today" and times are read in it on every screen. */
  firmTimezone: z.string(),
  /** The firm's units for areas and lengths shown on every screen (acres and feet when absent). */
  firmAreaUnit: z.enum(AREA_UNITS).optional(),
  firmLengthUnit: z.enum(LENGTH_UNITS).optional(),
  clientId: z.number().int().nullable(),
});
export type SessionUser = z.infer<typeof SessionUserSchema>;

export const InviteCreateSchema = z
  .object({
    email,
    name: z.string().trim().min(1, { message: 'enter the person’s name' }).max(LIMITS.nameMax),
    role: z.enum(['consultant', 'crew', 'client']),
    clientId: RecordIdSchema.optional(),
  })
  .refine((v) => v.role !== 'client' || v.clientId !== undefined, {
    message: 'choose the client this contact belongs to',
    path: ['clientId'],
  });
export type InviteCreateInput = z.infer<typeof InviteCreateSchema>;

export const TokenPasswordSchema = z
  .object({
    token: z.string().min(20).max(200),
    password,
    confirmPassword: z.string(),
  })
  .refine((v) => v.password === v.confirmPassword, { message: 'the two passwords differ', path: ['confirmPassword'] });
export type TokenPasswordInput = z.infer<typeof TokenPasswordSchema>;

/** The signed-in "change password" form. */
export const PasswordChangeSchema = z
  .object({
    currentPassword: z.string().min(1, { message: 'enter your current password' }).max(LIMITS.passwordMax),
    password,
    confirmPassword: z.string(),
  })
  .refine((v) => v.password === v.confirmPassword, { message: 'the two passwords differ', path: ['confirmPassword'] })
  .refine((v) => v.password !== v.currentPassword, { message: 'choose a password different from the current one', path: ['password'] });
export type PasswordChangeInput = z.infer<typeof PasswordChangeSchema>;

export const PasswordResetRequestSchema = z.object({ email });
export type PasswordResetRequestInput = z.infer<typeof PasswordResetRequestSchema>;

export const TeamMemberSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  clientId: z.number().int().nullable(),
  status: z.enum(['active', 'invited', 'disabled']),
  lastSignInAt: z.string().nullable(),
});
export type TeamMember = z.infer<typeof TeamMemberSchema>;

/** A new firm and its owner (`POST /api/signup`). */
export const SignupSchema = z.object({
  firmName: z.string().trim().min(1, { message: 'enter your firm’s name' }).max(LIMITS.nameMax),
  name: z.string().trim().min(1, { message: 'enter your name' }).max(LIMITS.nameMax),
  email,
  password,
  /** Where the firm works (optional; it can be set later in Settings). */
  homeArea: HomeAreaSchema.optional(),
});
export type SignupInput = z.infer<typeof SignupSchema>;

/** The token of an e-mail confirmation link (`POST /api/auth/verify-email`). */
export const VerifyEmailSchema = z.object({ token: z.string().min(20).max(200) });
