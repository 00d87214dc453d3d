import type { Role } from '@/db/schema';

const RANK: Record<Role, number> = { reader: 0, reviewer: 1, editor: 2, admin: 3 };

/** reader < reviewer < editor < admin: each role may do everything the roles below it may. */
export function hasRole(user: { role: Role } | null | undefined, role: Role): boolean {
  return !!user && RANK[user.role] >= RANK[role];
}

export const ROLE_LABELS: Record<Role, string> = {
  reader: 'Reader',
  reviewer: 'Reviewer',
  editor: 'Editor',
  admin: 'Admin',
};
