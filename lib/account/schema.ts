import { z } from 'zod';
import { passwordSchema } from '@/lib/password-rules';
import { email, name } from '@/lib/input';

/** Compare the two passwords even while another field is invalid, so the form can re-check the repeat as it is typed. */
const bothPasswordsTyped = {
  path: ['confirm'],
  message: 'The two passwords differ.',
  when: (payload: { value: unknown }) => {
    const v = payload.value as { password?: unknown; confirm?: unknown } | null;
    return typeof v?.password === 'string' && typeof v?.confirm === 'string';
  },
};

const tokenSchema = z.string().min(20, 'This link is not valid.').max(200, 'This link is not valid.');

export const acceptInvitationSchema = z
  .object({
    token: tokenSchema,
    name: name('Enter your name.'),
    password: passwordSchema,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, bothPasswordsTyped);

export const requestResetSchema = z.object({
  email,
});

export const resetPasswordSchema = z
  .object({ token: tokenSchema, password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, bothPasswordsTyped);

export const preferencesSchema = z.object({
  name: name('Enter your name.'),
  massUnits: z.enum(['metric', 'imperial']),
  temperatureUnit: z.enum(['C', 'F']),
});

export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;
export type PreferencesInput = z.infer<typeof preferencesSchema>;

/** What the accept page shows before the invitee commits. */
export interface InvitationPreview {
  email: string;
  workspaceName: string;
  role: string;
  hasAccount: boolean;
}
