import { MIN_PASSWORD_LENGTH } from '@rhotrace/api-types';
import { z } from 'zod';

export const emailField = z
  .string({ required_error: 'is required', invalid_type_error: 'must be text' })
  .max(254, 'must be at most 254 characters')
  .email('must be an e-mail address');

/** A new password: at least MIN_PASSWORD_LENGTH characters, at most 200 (bcrypt reads 72 bytes). */
export const passwordField = z
  .string({ required_error: 'is required', invalid_type_error: 'must be text' })
  .min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`)
  .max(200, 'must be at most 200 characters')
  .refine((p) => Buffer.byteLength(p, 'utf8') <= 72, 'must be at most 72 bytes long');

export const loginBody = z
  .object({
    email: emailField,
    password: z
      .string({ required_error: 'is required', invalid_type_error: 'must be text' })
      .min(1, 'is required')
      .max(200, 'must be at most 200 characters'),
  })
  .strict();

export const resetBody = z.object({ email: emailField }).strict();

export const confirmBody = z
  .object({
    token: z
      .string({ required_error: 'is required', invalid_type_error: 'must be text' })
      .min(1, 'is required')
      .max(200, 'must be at most 200 characters'),
    password: passwordField,
  })
  .strict();
