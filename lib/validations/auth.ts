import { z } from 'zod';
import { roles } from '@/lib/auth/roles';

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(200),
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignIn = z.infer<typeof signInSchema>;

export const memberCreateSchema = z
  .object({
    email: z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(200),
    name: z.string().trim().min(2, 'Name needs at least 2 characters').max(120),
    role: z.enum(roles),
    password: z.string().min(10, 'At least 10 characters').max(200),
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
