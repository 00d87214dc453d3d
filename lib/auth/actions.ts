'use server';

import { AuthError, CredentialsSignin } from 'next-auth';
import { getDb } from '@/db';
import { createMagicLinkToken } from '@/db/magic-links';
import { changeUserRole, createUser, DuplicateEmailError, findUserByEmail, setUserDisabled, UserNotFoundError } from '@/db/users';
import { zodFieldErrors } from '@/lib/http/api';
import { sendMail } from '@/lib/mail';
import { mayUseAccount } from './config';
import { requireRole } from './guard';
import { signIn, signOut } from './index';
import { safeNextPath } from './next-path';
import { hashPassword } from './password';
import { magicLinkBlockedFor } from './rate-limit';
import { magicLinkRequestSchema, roleChangeSchema, signInSchema, signUpSchema, type SignInInput, type SignUpInput } from './schemas';
import { AppError } from '@/lib/http/errors';

export interface FormState {
  ok?: boolean;
  message?: string;
  fields?: Record<string, string[]>;
}

const GENERIC_SIGN_IN_FAILURE = 'That e-mail address and password do not match an account that can sign in.';

export async function signUpAction(input: SignUpInput, next?: string): Promise<FormState> {
  const parsed = signUpSchema.safeParse(input);
  if (!parsed.success) return { message: 'Please correct the marked fields.', fields: zodFieldErrors(parsed.error) };
  const { email, name, password } = parsed.data;
  const passwordHash = await hashPassword(password);
  try {
    createUser(getDb(), { email, name, passwordHash });
  } catch (error) {
    if (error instanceof DuplicateEmailError) {
      return {
        message: 'No account was created.',
        fields: { email: ['An account already uses this e-mail address. Sign in instead, or ask for a sign-in link.'] },
      };
    }
    throw error;
  }
  await signIn('password', { email, password, redirectTo: safeNextPath(next) });
  return { ok: true };
}

export async function signInAction(input: SignInInput, next?: string): Promise<FormState> {
  const parsed = signInSchema.safeParse(input);
  if (!parsed.success) return { message: 'Please correct the marked fields.', fields: zodFieldErrors(parsed.error) };
  try {
    await signIn('password', { ...parsed.data, redirectTo: safeNextPath(next) });
  } catch (error) {
    if (error instanceof CredentialsSignin && error.code === 'rate_limited') {
      return { message: 'Too many failed attempts. Wait a few minutes, or ask for a sign-in link by e-mail.' };
    }
    if (error instanceof AuthError) return { message: GENERIC_SIGN_IN_FAILURE };
    throw error;
  }
  return { ok: true };
}

export async function requestMagicLinkAction(input: { email: string }): Promise<FormState> {
  const parsed = magicLinkRequestSchema.safeParse(input);
  if (!parsed.success) return { message: 'Please correct the marked fields.', fields: zodFieldErrors(parsed.error) };
  const { email } = parsed.data;
  const sent: FormState = {
    ok: true,
    message: `If ${email} belongs to an account, a sign-in link is on its way. It works once, within 10 minutes.`,
  };
  if ((await magicLinkBlockedFor(email)) > 0) return sent; // same answer: never reveal whether an account exists
  const db = getDb();
  const user = findUserByEmail(db, email);
  if (!user || !mayUseAccount(user)) return sent;
  const token = createMagicLinkToken(db, email);
  // The link is built from AUTH_URL, never from the request's Host header (Host-header poisoning).
  const base = process.env.AUTH_URL ?? 'http://localhost:3000';
  const link = `${base}/signin/confirm?token=${encodeURIComponent(token)}`;
  await sendMail({
    to: email,
    subject: 'Your Trailbench sign-in link',
    text: `Hello ${user.name},\n\nOpen this link and press "Sign in" to sign in to Trailbench:\n\n${link}\n\nThe link works once and expires in 10 minutes. If you did not ask for it, ignore this message.\n`,
  });
  return sent;
}

export async function confirmMagicLinkAction(token: string): Promise<FormState> {
  try {
    await signIn('magic-link', { token, redirectTo: '/' });
  } catch (error) {
    if (error instanceof AuthError) {
      return { message: 'This sign-in link has expired or was already used. Ask for a new one.' };
    }
    throw error;
  }
  return { ok: true };
}

export async function signOutAction(): Promise<void> {
  await signOut({ redirectTo: '/' });
}

async function adminAction<T>(work: (actorId: string) => T): Promise<FormState> {
  try {
    const actor = await requireRole('admin');
    work(actor.id);
    return { ok: true, message: 'Saved.' };
  } catch (error) {
    if (error instanceof AppError) return { message: error.message };
    if (error instanceof UserNotFoundError) return { message: 'That account no longer exists.' };
    throw error;
  }
}

export async function changeRoleAction(input: { userId: string; role: string }): Promise<FormState> {
  const parsed = roleChangeSchema.safeParse(input);
  if (!parsed.success) return { message: 'Choose one of the listed roles.', fields: zodFieldErrors(parsed.error) };
  return adminAction((actorId) => {
    if (actorId === parsed.data.userId) throw new AppError('forbidden', 'Admins cannot change their own role.');
    changeUserRole(getDb(), { ...parsed.data, actorId });
  });
}

export async function setDisabledAction(input: { userId: string; disabled: boolean }): Promise<FormState> {
  if (typeof input?.userId !== 'string' || typeof input?.disabled !== 'boolean') return { message: 'Bad request.' };
  return adminAction((actorId) => {
    if (actorId === input.userId) throw new AppError('forbidden', 'Admins cannot disable their own account.');
    setUserDisabled(getDb(), { ...input, actorId });
  });
}

