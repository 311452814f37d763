import { z } from 'zod';
import { passwordSchema } from '@/lib/passwords';
import { email, name } from '@/lib/input';

const tokenSchema = z.string().min(20, 'This link is not valid.').max(200, 'This link is not valid.');

export const acceptInvitationSchema = z
  .object({
    token: tokenSchema,
    name: name('Enter your name.'),
    password: passwordSchema,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

export const requestResetSchema = z.object({
  email,
});

export const resetPasswordSchema = z
  .object({ token: tokenSchema, password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

export const preferencesSchema = z.object({
  name: name('Enter your name.'),
  massUnits: z.enum(['metric', 'imperial']),
  temperatureUnit: z.enum(['C', 'F']),
});

export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;
export type PreferencesInput = z.infer<typeof preferencesSchema>;
