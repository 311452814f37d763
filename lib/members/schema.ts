import { z } from 'zod';
import { ROLES } from '@/lib/permissions';
import { email } from '@/lib/input';

export const roleSchema = z.enum(ROLES, { error: 'Choose one of the roles.' });

export const inviteMemberSchema = z.object({
  email,
  role: roleSchema,
}).strict();

export const updateMemberSchema = z
  .object({ role: roleSchema.optional(), active: z.boolean().optional() })
  .strict()
  .refine((v) => v.role !== undefined || v.active !== undefined, 'Change the role or the active flag.');

export type InviteMemberInput = z.infer<typeof inviteMemberSchema>;
export type UpdateMemberInput = z.infer<typeof updateMemberSchema>;

export interface MemberRow {
  membershipId: string;
  userId: string;
  name: string;
  email: string;
  role: z.infer<typeof roleSchema>;
  active: boolean;
  joinedAt: string;
}

export interface PendingInvitation {
  invitationId: string;
  email: string;
  role: z.infer<typeof roleSchema>;
  invitedBy: string;
  expiresAt: string;
}
