import { z } from 'zod';

export const MIN_PASSWORD_LENGTH = 10;

export const roleSchema = z.enum(['grower', 'educator', 'admin']);
export type Role = z.infer<typeof roleSchema>;
export const languageSchema = z.enum(['en', 'es']);
export const unitSystemChoiceSchema = z.enum(['metric', 'us']);

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'E-mail address is too long.')
  .pipe(z.email('Enter a valid e-mail address.'));

export const passwordSchema = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
  .max(200, 'Use at most 200 characters.');

export const signUpInputSchema = z.object({
  email: emailSchema,
  password: passwordSchema,
  displayName: z.string().trim().min(1, 'Enter a name to show.').max(80),
  /** Growers sign up as growers; educators ask for the educator role at sign-up. */
  role: z.enum(['grower', 'educator']).default('grower'),
  language: languageSchema.default('en'),
  unitSystem: unitSystemChoiceSchema.default('metric'),
});
export type SignUpInput = z.infer<typeof signUpInputSchema>;

export const signInInputSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const requestPasswordResetInputSchema = z.object({ email: emailSchema });
export type RequestPasswordResetInput = z.infer<typeof requestPasswordResetInputSchema>;

export const resetPasswordInputSchema = z.object({
  token: z.string().min(20).max(200),
  password: passwordSchema,
});
export type ResetPasswordInput = z.infer<typeof resetPasswordInputSchema>;

export const verifyEmailInputSchema = z.object({ token: z.string().min(20).max(200) });

export const changePasswordInputSchema = z.object({
  currentPassword: z.string().min(1).max(200),
  newPassword: passwordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

export const updateAccountInputSchema = z
  .object({
    displayName: z.string().trim().min(1).max(80),
    unitSystem: unitSystemChoiceSchema,
    language: languageSchema,
  })
  .partial();
export type UpdateAccountInput = z.infer<typeof updateAccountInputSchema>;

export const accountSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  unitSystem: unitSystemChoiceSchema,
  language: languageSchema,
  emailVerified: z.boolean(),
  createdAt: z.string(),
});
export type Account = z.infer<typeof accountSchema>;

export const sessionInfoSchema = z.object({
  user: accountSchema.nullable(),
  csrfToken: z.string(),
});
export type SessionInfo = z.infer<typeof sessionInfoSchema>;

/** Admin view of accounts. */
export const adminUpdateUserInputSchema = z
  .object({ role: roleSchema, disabled: z.boolean() })
  .partial()
  .refine((v) => v.role !== undefined || v.disabled !== undefined, 'Nothing to change.');
export type AdminUpdateUserInput = z.infer<typeof adminUpdateUserInputSchema>;

export const adminUserSchema = accountSchema.extend({ disabled: z.boolean() });
export type AdminUser = z.infer<typeof adminUserSchema>;

export const listUsersQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
