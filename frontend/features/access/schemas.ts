import { z } from 'zod';
import { passwordProblem } from '../../../shared/schemas/password';

const email = z
  .string()
  .trim()
  .min(3, 'enter your e-mail address')
  .max(254)
  .email('this is no e-mail address');
const newPassword = z.string().superRefine((p, ctx) => {
  const problem = passwordProblem(p);
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
});

export const signInSchema = z.object({
  email,
  password: z.string().min(1, 'enter your password').max(200),
});
export const signUpSchema = z.object({
  name: z.string().trim().min(1, 'enter your name').max(100),
  email,
  password: newPassword,
});
export const resetRequestSchema = z.object({ email });
export const resetSchema = z.object({ password: newPassword });
export const newKeySchema = z.object({
  name: z.string().trim().min(1, 'name the key after the tool that will use it').max(80),
  role: z.enum(['reader', 'integrator', 'curator', 'admin']),
  expiresInDays: z
    .string()
    .refine(
      (v) => v === '' || (Number.isInteger(Number(v)) && Number(v) >= 1 && Number(v) <= 730),
      '1 to 730 days, or empty for no expiry',
    ),
});
