import { z } from 'zod';
import { roles } from '@/lib/auth/roles';

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(200),
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignIn = z.infer<typeof signInSchema>;

/** Shortest password an account may set (members added by an admin, a password change). */
export const minPasswordLength = 10;

const passwordChangeFields = {
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword: z.string().min(minPasswordLength, `At least ${minPasswordLength} characters`).max(200, 'At most 200 characters'),
};
const newDiffers = (p: { currentPassword: string; newPassword: string }) => p.newPassword !== p.currentPassword;
const newDiffersError = { message: 'Choose a password other than the current one', path: ['newPassword'] };

export const passwordChangeSchema = z.object(passwordChangeFields).refine(newDiffers, newDiffersError);
export type PasswordChange = z.infer<typeof passwordChangeSchema>;

/** The form asks for the new password twice; the route takes it once. */
export const passwordChangeFormSchema = z
  .object({ ...passwordChangeFields, repeatPassword: z.string() })
  .refine(newDiffers, newDiffersError)
  .refine((p) => p.repeatPassword === p.newPassword, { message: 'The two new passwords differ', path: ['repeatPassword'] });
export type PasswordChangeForm = z.infer<typeof passwordChangeFormSchema>;

export const memberCreateSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(200),
    name: z.string().trim().min(2, 'Name needs at least 2 characters').max(120),
    role: z.enum(roles),
    password: z.string().min(minPasswordLength, `At least ${minPasswordLength} characters`).max(200),
    organisationId: z.string().uuid().nullable().default(null),
  })
  .refine((m) => (m.role === 'client' || m.role === 'mill' ? !!m.organisationId : true), {
    message: 'Mill and client accounts belong to a mill or client organisation',
    path: ['organisationId'],
  });
export type MemberCreate = z.infer<typeof memberCreateSchema>;

export const memberPatchSchema = z
  .object({
    role: z.enum(roles).optional(),
    active: z.boolean().optional(),
    name: z.string().trim().min(2).max(120).optional(),
    organisationId: z.string().uuid().nullable().optional(),
  })
  .strict();
export type MemberPatch = z.infer<typeof memberPatchSchema>;
