/** Scenario sets on the service (personal, or owned by a desk): bodies and the listed shape. */
import { z } from 'zod';
import type { Role } from './roles';

const setName = z.string().trim().min(1, 'must not be empty').max(120);
export const setCreateBody = z.object({
  name: setName,
  deskId: z.string().uuid('must be a UUID').optional(),
});
export const setPatchBody = z.object({ name: setName });

/** A scenario set as the service lists it to one user. */
export interface ScenarioSet {
  id: string;
  name: string;
  deskId: string | null;
  deskName: string | null;
  role: 'owner' | Role;
  canWrite: boolean;
  canManage: boolean;
  scenarios: number;
}

/** One revision of a scenario's history. */
export interface Revision {
  revision: number;
  document: unknown;
  deleted: boolean;
  author: string | null;
  createdAt: string;
}
