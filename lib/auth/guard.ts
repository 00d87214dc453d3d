import 'server-only';
import { forbidden, redirect } from 'next/navigation';
import { getDb } from '@/db';
import { findUserById } from '@/db/users';
import type { Role } from '@/db/schema';
import { AppError } from '@/lib/http/errors';
import { auth } from './index';
import { mayUseAccount } from './config';
import { hasRole } from './roles';

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

/** The signed-in user, re-read from the database (the session only carries the id). */
export async function getCurrentUser(): Promise<CurrentUser | null> {
  const session = await auth();
  const id = session?.user?.id;
  if (!id) return null;
  const user = findUserById(getDb(), id);
  if (!user || !mayUseAccount(user)) return null;
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/** For route handlers and server actions: 401 without an account, 403 with too low a role. */
export async function requireUser(): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) throw new AppError('unauthenticated', 'Sign in to do this.');
  return user;
}

export async function requireRole(role: Role): Promise<CurrentUser> {
  const user = await requireUser();
  if (!hasRole(user, role)) throw new AppError('forbidden', `This needs the ${role} role.`);
  return user;
}

/** Owners may change their own records; editors and admins may change anyone's. */
export function assertOwnerOrEditor(user: CurrentUser, ownerId: string): void {
  if (user.id !== ownerId && !hasRole(user, 'editor')) {
    throw new AppError('forbidden', 'Only the author or an editor may change this.');
  }
}

/** For pages: redirects to sign-in (the page's 401) and renders the 403 page for too low a role. */
export async function requirePageUser(returnTo: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) redirect(`/signin?next=${encodeURIComponent(returnTo)}`);
  return user;
}

export async function requirePageRole(role: Role, returnTo: string): Promise<CurrentUser> {
  const user = await requirePageUser(returnTo);
  if (!hasRole(user, role)) forbidden();
  return user;
}
