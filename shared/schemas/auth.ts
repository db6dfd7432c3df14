import { z } from 'zod';

export const emailSchema = z
  .string({ message: 'Enter an e-mail address' })
  .trim()
  .toLowerCase()
  .max(254, { message: 'E-mail address is too long' })
  .pipe(z.email({ message: 'Enter a valid e-mail address' }));

export const passwordSchema = z
  .string({ message: 'Enter a password' })
  .min(10, { message: 'Use at least 10 characters' })
  .max(256, { message: 'Use at most 256 characters' });

export const displayNameSchema = z
  .string({ message: 'Enter your name' })
  .trim()
  .min(1, { message: 'Enter your name' })
  .max(80, { message: 'Use at most 80 characters' });

export const signUpInputSchema = z.object({
  email: emailSchema,
  password: passwordSchema,
  displayName: displayNameSchema,
});
export type SignUpInput = z.infer<typeof signUpInputSchema>;

export const signInInputSchema = z.object({
  email: emailSchema,
  // Only bounded here: an old password that predates a rule change must still sign in.
  password: z
    .string({ message: 'Enter your password' })
    .min(1, { message: 'Enter your password' })
    .max(256, { message: 'Use at most 256 characters' }),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  displayName: z.string(),
});
export type User = z.infer<typeof userSchema>;
