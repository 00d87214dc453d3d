import { z } from 'zod';

export const emailField = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email({ message: 'Enter an e-mail address such as name@example.org.' }));

// ASVS 5.0 6.2.1 / 6.2.9: at least 8 characters, at least 64 allowed, no composition rules, no truncation.
export const newPasswordField = z
  .string()
  .min(8, 'Use at least 8 characters for your password.')
  .max(128, 'Use at most 128 characters for your password.');

export const signUpSchema = z
  .object({
    name: z.string().trim().min(1, 'Tell us the name to show on your reviews.').max(80, 'Use at most 80 characters.'),
    email: emailField,
    password: newPasswordField,
  })
  .strict();
export type SignUpInput = z.input<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailField,
  password: z.string().min(1, 'Enter your password.').max(128, 'Use at most 128 characters.'),
});
export type SignInInput = z.input<typeof signInSchema>;

export const magicLinkRequestSchema = z.object({ email: emailField });

export const roleChangeSchema = z
  .object({
    userId: z.string().min(1),
    role: z.enum(['reader', 'reviewer', 'editor', 'admin']),
  })
  .strict();
