import { z } from 'zod';

// Mirrors the server's rules (10-200 characters) so most mistakes are caught before a round trip;
// the server's own answer (e.g. a too-common password) is still shown on the field.
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

const password = z
  .string()
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`);

export const signInSchema = z.object({
  email: z.email('Enter the email you signed up with'),
  password: z.string().min(1, 'Enter your password'),
});
export type SignInValues = z.infer<typeof signInSchema>;

export const signUpSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name').max(100, 'Use at most 100 characters'),
  organizationName: z
    .string()
    .trim()
    .min(1, 'Give your studio a name')
    .max(100, 'Use at most 100 characters'),
  email: z.email('Enter a valid email address').max(254, 'That address is too long'),
  password,
});
export type SignUpValues = z.infer<typeof signUpSchema>;

export const forgotPasswordSchema = z.object({
  email: z.email('Enter a valid email address'),
});
export type ForgotPasswordValues = z.infer<typeof forgotPasswordSchema>;

export const newPasswordSchema = z
  .object({ password, confirm: z.string() })
  .refine((values) => values.password === values.confirm, {
    message: 'The two passwords differ',
    path: ['confirm'],
  });
export type NewPasswordValues = z.infer<typeof newPasswordSchema>;

/** Accepting an invite: a new account needs a name and password; an existing one needs neither. */
export function acceptInviteSchema(existingAccount: boolean) {
  if (existingAccount)
    return z.object({ name: z.string().optional(), password: z.string().optional() });
  return z.object({
    name: z.string().trim().min(1, 'Enter your name').max(100, 'Use at most 100 characters'),
    password,
  });
}
export type AcceptInviteValues = { name?: string; password?: string };
