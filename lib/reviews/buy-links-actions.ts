'use server';

import { revalidatePath } from 'next/cache';
import { getDb } from '@/db';
import { saveBuyLinks } from '@/db/reviews';
import { requireUser } from '@/lib/auth/guard';
import { AppError } from '@/lib/http/errors';

export interface BuyLinksFormState {
  ok?: boolean;
  message?: string;
  /** Keys like "links.0.url" (zod paths). */
  fields?: Record<string, string[]>;
}

/**
 * Saves the where-to-buy links of the author's working revision. The session is checked here and
 * db/reviews.ts `saveBuyLinks` checks visibility, authorship, state and the zod schema again inside
 * its transaction; refusals come back as a message, never a 500.
 */
export async function saveBuyLinksAction(reviewId: unknown, input: unknown): Promise<BuyLinksFormState> {
  try {
    const user = await requireUser();
    if (typeof reviewId !== 'string' || reviewId.length === 0 || reviewId.length > 100) throw new AppError('not_found', 'No review here, or you may not see it.');
    const links = saveBuyLinks(getDb(), user, reviewId, input);
    revalidatePath(`/write/${reviewId}`);
    return { ok: true, message: links.length ? `Saved ${links.length} link${links.length === 1 ? '' : 's'}.` : 'Saved: no where-to-buy links.' };
  } catch (error) {
    if (error instanceof AppError) {
      const generic = error.code === 'invalid' && error.message === 'Some fields are not valid.';
      return { ok: false, message: generic ? 'Please correct the marked links. Nothing was saved.' : error.message, fields: error.fields };
    }
    throw error;
  }
}
