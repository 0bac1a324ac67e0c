/** Desks, members and invites: request bodies and the answers' shapes. */
import { z } from 'zod';
import { emailSchema } from './accounts';
import { roleSchema, type Role } from './roles';

export const deskBody = z.object({ name: z.string().trim().min(1, 'must not be empty').max(100) });
export const roleBody = z.object({ role: roleSchema });
export const inviteBody = z.object({ email: emailSchema, role: roleSchema });

export interface Desk {
  id: string;
  name: string;
  role: Role;
}
export interface Member {
  id: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}
export interface Invite {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
}
