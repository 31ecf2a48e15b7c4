// Sign-in forms: password sign-in and "e-mail me a sign-in link", shared by the forms and next-auth's authorize().
// Sign-up only happens through an invitation (see lib/validations/invitation.ts).
import { z } from 'zod';
import { emailSchema } from './common';

export const passwordSignInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(1024, 'Password is too long'),
});
export type PasswordSignIn = z.infer<typeof passwordSignInSchema>;

export const magicLinkSchema = z.object({ email: emailSchema });
export type MagicLink = z.infer<typeof magicLinkSchema>;
