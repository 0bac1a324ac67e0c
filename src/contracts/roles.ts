/** The roles on a desk (what each may do is checked by the service, never by the client). */
import { z } from 'zod';

export const ROLES = ['lead', 'trader', 'analyst'] as const;
export const roleSchema = z.enum(ROLES, { error: 'must be lead, trader or analyst' });
export type Role = z.infer<typeof roleSchema>;
