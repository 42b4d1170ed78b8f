import { z } from 'zod'
import { ROLE_NAMES } from '../types/roles'

// ASVS 2.1.1: at least 12 characters; 2.1.2: up to 128 allowed.
export const passwordSchema = z.string().min(12, 'at least 12 characters').max(128, 'at most 128 characters')

export const userCreateSchema = z.object({
  email: z.string().trim().toLowerCase().email('a valid e-mail address').max(320),
  name: z.string().trim().min(1, 'required').max(120),
  roles: z.array(z.enum(ROLE_NAMES)).min(1, 'at least one role').max(4),
  password: passwordSchema,
}).strict()

export const userUpdateSchema = z.object({
  email: z.string().trim().toLowerCase().email('a valid e-mail address').max(320).optional(),
  name: z.string().trim().min(1, 'required').max(120).optional(),
  roles: z.array(z.enum(ROLE_NAMES)).min(1, 'at least one role').max(4).optional(),
  active: z.boolean().optional(),
}).strict()

export const passwordResetSchema = z.object({ password: passwordSchema }).strict()

export type UserCreate = z.infer<typeof userCreateSchema>
export type UserUpdate = z.infer<typeof userUpdateSchema>

export const passwordChangeSchema = z.object({
  currentPassword: z.string({ error: 'your current password' }).min(1, 'your current password').max(1024),
  newPassword: passwordSchema,
}).strict()
