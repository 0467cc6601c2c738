import { z } from 'zod';
import { labRoleSchema } from './roles';

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter an e-mail address like name@example.org' }));

/**
 * Length over composition rules (NIST SP 800-63B §5.1.1.2): at least 10 characters, at most 200 so that
 * bcrypt's 72-byte input limit is the only truncation, and not only spaces.
 */
export const passwordSchema = z
  .string()
  .min(10, { error: 'Use at least 10 characters' })
  .max(200, { error: 'Use at most 200 characters' })
  .refine((value) => value.trim().length > 0, { error: 'A password cannot be only spaces' });

export const displayNameSchema = z
  .string()
  .trim()
  .min(1, { error: 'Enter your name as colleagues should see it' })
  .max(120, { error: 'Use at most 120 characters' });

export const labNameSchema = z
  .string()
  .trim()
  .min(2, { error: 'Enter a lab name of at least 2 characters' })
  .max(120, { error: 'Use at most 120 characters' });

/** POST /api/auth/sign-in. The password is not checked against the rule: old passwords must still work. */
export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { error: 'Enter your password' }).max(200),
});
export type SignIn = z.infer<typeof signInSchema>;

/** POST /api/auth/sign-up: a new person starting a new lab, confirmed through a link in a mail. */
export const signUpSchema = z.object({
  email: emailSchema,
  displayName: displayNameSchema,
  password: passwordSchema,
  labName: labNameSchema,
});
export type SignUp = z.infer<typeof signUpSchema>;

/** A one-time token from a link in a mail. */
export const mailTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, { error: 'This link is not complete' });

export const confirmSignUpSchema = z.object({ token: mailTokenSchema });

export const requestPasswordResetSchema = z.object({ email: emailSchema });

export const resetPasswordSchema = z.object({ token: mailTokenSchema, password: passwordSchema });

/** The answer to requests whose outcome must not reveal whether an account exists. */
export const mailSentSchema = z.object({ message: z.string() });
export type MailSent = z.infer<typeof mailSentSchema>;

export const userSchema = z.object({ id: z.uuid(), email: z.string(), displayName: z.string() });
export type UserSummary = z.infer<typeof userSchema>;

export const myMembershipSchema = z.object({ labId: z.uuid(), labName: z.string(), role: labRoleSchema });
export type MyMembership = z.infer<typeof myMembershipSchema>;

/** GET /api/me */
export const meSchema = z.object({ user: userSchema, memberships: z.array(myMembershipSchema) });
export type Me = z.infer<typeof meSchema>;

/** GET /api/auth/demo-accounts: the demo sign-ins, listed only in a local installation with demo data. */
export const demoAccountsSchema = z.object({
  accounts: z.array(z.object({ email: z.string(), displayName: z.string(), role: labRoleSchema })),
  password: z.string().nullable(),
});
export type DemoAccounts = z.infer<typeof demoAccountsSchema>;

/** The answer of sign-in and of confirming a sign-up: the session itself travels in the cookie. */
export const signedInSchema = z.object({ user: userSchema });

/** The form that chooses a new password: typed twice, so a typo does not lock the person out. */
export const newPasswordFormSchema = z
  .object({ password: passwordSchema, repeat: z.string() })
  .refine((values) => values.password === values.repeat, { path: ['repeat'], error: 'The two passwords differ' });
