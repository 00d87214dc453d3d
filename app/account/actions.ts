'use server';

import { revalidatePath } from 'next/cache';
import { cookies } from 'next/headers';
import { getDb } from '@/db';
import { setUnitPreference } from '@/db/account';
import { createApiToken, revokeApiToken } from '@/db/api-tokens';
import { getCurrentUser, requireUser } from '@/lib/auth/guard';
import { zodFieldErrors } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import { UNITS_COOKIE } from '@/lib/units/preference';
import { apiTokenInputSchema, apiTokenRevokeSchema, unitSystemSchema, type ApiTokenInput } from './schemas';

export interface TokenActionState {
  ok?: boolean;
  message?: string;
  fields?: Record<string, string[]>;
  /** The new token, returned once and never stored. */
  token?: string;
}

function refused(error: unknown): TokenActionState {
  if (error instanceof AppError) return { message: error.message };
  throw error;
}

export async function createApiTokenAction(input: ApiTokenInput): Promise<TokenActionState> {
  const parsed = apiTokenInputSchema.safeParse(input);
  if (!parsed.success) return { message: 'Please correct the marked fields.', fields: zodFieldErrors(parsed.error) };
  try {
    const user = await requireUser();
    const { token } = createApiToken(getDb(), user, parsed.data);
    revalidatePath('/account');
    return { ok: true, token, message: 'Token created. Copy it now: it is shown only this once.' };
  } catch (error) {
    return refused(error);
  }
}

export async function revokeApiTokenAction(input: { tokenId: string }): Promise<TokenActionState> {
  const parsed = apiTokenRevokeSchema.safeParse(input);
  if (!parsed.success) return { message: 'No such token.' };
  try {
    const user = await requireUser();
    revokeApiToken(getDb(), user.id, parsed.data.tokenId);
    revalidatePath('/account');
    return { ok: true, message: 'Token revoked. Requests that use it are refused from now on.' };
  } catch (error) {
    return refused(error);
  }
}

/** Saves the display units: on the profile when signed in, and in a cookie (which is all a guest has). */
export async function setUnitSystemAction(system: string): Promise<{ ok: boolean; message?: string }> {
  const parsed = unitSystemSchema.safeParse(system);
  if (!parsed.success) return { ok: false, message: 'Choose metric or imperial.' };
  const user = await getCurrentUser();
  if (user) setUnitPreference(getDb(), user.id, parsed.data);
  (await cookies()).set(UNITS_COOKIE, parsed.data, {
    path: '/',
    sameSite: 'lax',
    httpOnly: true,
    secure: (process.env.AUTH_URL ?? '').startsWith('https://'),
    maxAge: 365 * 24 * 60 * 60,
  });
  revalidatePath('/', 'layout');
  return { ok: true };
}
