import { z } from 'zod';
import { ROLES } from '../domain';
import { email, requiredText } from './common';

export const loginSchema = z.strictObject({
  email: z.string().trim().toLowerCase().pipe(email),
  password: z.string().min(1, 'is required').max(200),
});
export type LoginInput = z.infer<typeof loginSchema>;

export const userCreateSchema = z.strictObject({
  email: z.string().trim().toLowerCase().pipe(email),
  name: requiredText(120),
  role: z.enum(ROLES),
  password: z.string().min(10, 'must be at least 10 characters').max(200),
});
export type UserCreateInput = z.infer<typeof userCreateSchema>;

export const userUpdateSchema = z.strictObject({
  name: requiredText(120).optional(),
  role: z.enum(ROLES).optional(),
  active: z.boolean().optional(),
  password: z.string().min(10, 'must be at least 10 characters').max(200).optional(),
  version: z.number().int().positive(),
});
export type UserUpdateInput = z.infer<typeof userUpdateSchema>;
