import { z } from 'zod';

// The server's rules (auth DTOs and passwords.ts), checked here first so most slips need no round
// trip; what only the server knows (a wrong or too-common password, a taken address) comes back
// on the field.
export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

export const nameSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name').max(100, 'Use at most 100 characters'),
});

export const emailChangeSchema = z.object({
  newEmail: z.email('Enter a valid email address').max(254, 'That address is too long'),
  password: z.string().min(1, 'Enter your current password'),
});
export type EmailChangeValues = z.infer<typeof emailChangeSchema>;

export const passwordChangeSchema = z
  .object({
    currentPassword: z.string().min(1, 'Enter your current password'),
    newPassword: z
      .string()
      .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
      .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`),
    confirm: z.string(),
  })
  .refine((values) => values.newPassword === values.confirm, {
    message: 'The two passwords differ',
    path: ['confirm'],
  });
export type PasswordChangeValues = z.infer<typeof passwordChangeSchema>;
