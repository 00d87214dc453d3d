'use server';

import { redirect } from 'next/navigation';
import { getDb } from '@/db';
import { approveGear, createGear, sendBackGear, submitGear, updateGear, withdrawGear } from '@/db/gear';
import { requireRole, requireUser } from '@/lib/auth/guard';
import { parseWith } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import { gearEditPath, gearPath } from './paths';
import { sendBackSchema } from './schemas';

export interface GearFormState {
  ok?: boolean;
  message?: string;
  fields?: Record<string, string[]>;
}

/** Runs a change; AppErrors become a form message with field errors (never a 500). */
async function run(work: () => Promise<string | void> | string | void): Promise<GearFormState> {
  let target: string | void;
  try {
    target = await work();
  } catch (error) {
    if (error instanceof AppError) {
      return { message: error.code === 'invalid' ? 'Please correct the marked fields. Nothing was saved.' : error.message, fields: error.fields };
    }
    throw error;
  }
  if (target) redirect(target);
  return { ok: true, message: 'Saved.' };
}

/** Creates a draft gear item (the same schema as the form and POST /api/v1/gear). */
export async function createGearAction(input: unknown): Promise<GearFormState> {
  return run(async () => {
    const user = await requireRole('reviewer');
    const { slug } = createGear(getDb(), user, input);
    return gearPath(slug);
  });
}

/** Saves changes to an item (the same schema as the form and PATCH /api/v1/gear/{slug}). */
export async function updateGearAction(slug: string, input: unknown): Promise<GearFormState> {
  return run(async () => {
    const user = await requireUser();
    const result = updateGear(getDb(), user, String(slug), input);
    return gearPath(result.slug);
  });
}

export async function submitGearAction(slug: string): Promise<GearFormState> {
  return run(async () => {
    const user = await requireUser();
    submitGear(getDb(), user, String(slug));
    return gearPath(String(slug));
  });
}

export async function withdrawGearAction(slug: string): Promise<GearFormState> {
  return run(async () => {
    const user = await requireUser();
    withdrawGear(getDb(), user, String(slug));
    return gearEditPath(String(slug));
  });
}

export async function approveGearAction(slug: string): Promise<GearFormState> {
  return run(async () => {
    const user = await requireUser();
    approveGear(getDb(), user, String(slug));
    return gearPath(String(slug));
  });
}

export async function sendBackGearAction(slug: string, input: unknown): Promise<GearFormState> {
  return run(async () => {
    const user = await requireUser();
    const { comment } = parseWith(sendBackSchema, input);
    sendBackGear(getDb(), user, String(slug), comment);
    return gearPath(String(slug));
  });
}
