import * as z from 'zod';
import { text } from './text';

export const ROLES = ['engineer', 'reviewer', 'winder', 'admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const themeSchema = z.enum(['light', 'dark']);
export type Theme = z.infer<typeof themeSchema>;

// ASVS 6.2.1/6.2.9: at least 8 characters, long passphrases accepted, no composition rules.
export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 256;
export const passwordSchema = text({ error: 'Password is required' })
  .min(PASSWORD_MIN, { error: `At least ${PASSWORD_MIN} characters` })
  .max(PASSWORD_MAX, { error: `At most ${PASSWORD_MAX} characters` });

export const usernameSchema = text({ error: 'Username is required' })
  .trim()
  .min(3, { error: 'At least 3 characters' })
  .max(40, { error: 'At most 40 characters' })
  .regex(/^[a-z0-9._-]+$/, { error: 'Lower-case letters, digits, dot, dash and underscore only' });

export const displayNameSchema = text({ error: 'Display name is required' })
  .trim()
  .min(1, { error: 'Display name is required' })
  .max(80, { error: 'At most 80 characters' });

export const userSchema = z.object({
  id: z.number().int(),
  username: z.string(),
  displayName: z.string(),
  email: z.string().nullable(),
  role: roleSchema,
  theme: themeSchema.nullable(),
  disabled: z.boolean(),
  createdAt: z.string(),
  lastSignInAt: z.string().nullable(),
});
export type User = z.infer<typeof userSchema>;

export const sessionResponseSchema = z.object({ user: userSchema.nullable() });
/** The answer of a change to one account (preferences, an admin's create or update). */
export const userResponseSchema = z.object({ user: userSchema });

export const signInRequestSchema = z
  .object({
    username: text({ error: 'Username is required' }).trim().min(1, { error: 'Username is required' }).max(40),
    password: text({ error: 'Password is required' }).min(1, { error: 'Password is required' }).max(PASSWORD_MAX),
  })
  .strict();
export type SignInRequest = z.infer<typeof signInRequestSchema>;

export const changePasswordRequestSchema = z
  .object({
    currentPassword: text({ error: 'Current password is required' }).min(1, { error: 'Current password is required' }),
    newPassword: passwordSchema,
  })
  .strict();
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;

export const preferencesRequestSchema = z.object({ theme: themeSchema }).strict();
export type PreferencesRequest = z.infer<typeof preferencesRequestSchema>;

export const createUserRequestSchema = z
  .object({
    username: usernameSchema,
    displayName: displayNameSchema,
    email: z.email({ error: 'Not a valid e-mail address' }).max(200).nullable().optional(),
    role: roleSchema,
    password: passwordSchema,
  })
  .strict();
export type CreateUserRequest = z.infer<typeof createUserRequestSchema>;

export const updateUserRequestSchema = z
  .object({
    displayName: displayNameSchema.optional(),
    role: roleSchema.optional(),
    disabled: z.boolean().optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { error: 'Nothing to change' });
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;

/**
 * An account as the admin user list shows it, with what the signed-in admin may do to it (the server's rule:
 * nobody disables their own account or removes their own admin role).
 */
export const adminUserSchema = userSchema.extend({ canChangeRole: z.boolean(), canDisable: z.boolean() });
export type AdminUser = z.infer<typeof adminUserSchema>;
export const userListResponseSchema = z.object({ users: z.array(adminUserSchema) });
export const adminUserResponseSchema = z.object({ user: adminUserSchema });

export const auditEntrySchema = z.object({
  id: z.number().int(),
  at: z.string(),
  actor: z.string().nullable(),
  action: z.string(),
  target: z.string().nullable(),
  details: z.string().nullable(),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;
export const auditPageResponseSchema = z.object({ entries: z.array(auditEntrySchema), total: z.number().int() });
