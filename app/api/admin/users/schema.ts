import { z } from 'zod';
import { emailSchema, passwordSchema, rolesSchema } from '@/lib/auth/users';

export const createUserBody = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, 'Enter a name').max(120, 'Name is too long (120 characters at most)'),
  password: passwordSchema,
  roles: rolesSchema,
}).strict();

export const updateUserBody = z.object({
  roles: rolesSchema.optional(),
  isActive: z.boolean().optional(),
  name: z.string().trim().min(1).max(120).optional(),
}).strict();

export const userIdParams = z.object({ id: z.coerce.number().int().positive() });
