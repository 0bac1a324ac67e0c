/** Request bodies of registration, sign-in, password change and reset. */
import { z } from 'zod';

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .email('must be an e-mail address')
  .max(254);
const newPassword = z.string().min(10, 'must be at least 10 characters').max(200);
const oneTimeToken = z.string().min(20).max(200);

export const registerBody = z.object({
  email: emailSchema,
  password: newPassword,
  name: z.string().trim().min(1, 'must not be empty').max(100),
});
export const signinBody = z.object({ email: emailSchema, password: z.string().min(1).max(200) });
export const passwordChangeBody = z.object({
  currentPassword: z.string().min(1).max(200),
  newPassword,
});
export const resetRequestBody = z.object({ email: emailSchema });
export const resetBody = z.object({ token: oneTimeToken, newPassword });
export const inviteAcceptBody = z.object({ token: oneTimeToken });
