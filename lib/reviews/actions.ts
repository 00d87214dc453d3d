'use server';

/**
 * Server actions of the review workflow. Each checks the session itself (requireUser/requireRole),
 * parses its input with the same zod schema as the form, and calls db/reviews.ts, which checks
 * visibility (404), permission (403) and state (409) again inside its transaction. Failures come back
 * as a form state with a message (never a 500); refused authorizations are logged.
 */
import { redirect } from 'next/navigation';
import { revalidatePath } from 'next/cache';
import { getDb } from '@/db';
import { createReviewDraft, saveNotificationSettings, transitionReview, updateReviewDraft, type TransitionOutcome } from '@/db/reviews';
import { logAuthEvent } from '@/db/users';
import { requireRole, requireUser, type CurrentUser } from '@/lib/auth/guard';
import { parseWith } from '@/lib/http/api';
import { AppError } from '@/lib/http/errors';
import type { WorkflowAction } from '@/lib/workflow/transitions';
import { notifyTransition } from './notify';
import { requestChangesSchema, retractSchema } from './schemas';

export interface ReviewFormState {
  ok?: boolean;
  message?: string;
  fields?: Record<string, string[]>;
  /** ISO time of the last save (autosave). */
  savedAt?: string;
}

function idOf(value: unknown): string {
  if (typeof value !== 'string' || value.length === 0 || value.length > 100) throw new AppError('not_found', 'No review here, or you may not see it.');
  return value;
}

async function run(label: string, work: (user: { current?: CurrentUser }) => Promise<string | ReviewFormState | void>): Promise<ReviewFormState> {
  const who: { current?: CurrentUser } = {};
  let result: string | ReviewFormState | void;
  try {
    result = await work(who);
  } catch (error) {
    if (error instanceof AppError) {
      if ((error.code === 'forbidden' || error.code === 'not_found') && who.current) {
        try {
          logAuthEvent(getDb(), { kind: 'authz-denied', userId: who.current.id, detail: `${label}: ${error.code}` });
        } catch {
          /* logging must not turn a refusal into a 500 */
        }
      }
      const generic = error.code === 'invalid' && error.message === 'Some fields are not valid.';
      return { ok: false, message: generic ? 'Please correct the marked fields. Nothing was saved.' : error.message, fields: error.fields };
    }
    throw error;
  }
  if (typeof result === 'string') redirect(result);
  return result ?? { ok: true };
}

/** Starts a review draft and opens it for writing. */
export async function createReviewAction(input: unknown): Promise<ReviewFormState> {
  return run('create review', async (who) => {
    const user = (who.current = await requireRole('reviewer'));
    const { id } = createReviewDraft(getDb(), user, input);
    return `/write/${id}`;
  });
}

/** Saves the draft's text (autosave and the Save button). */
export async function saveReviewDraftAction(reviewId: unknown, input: unknown): Promise<ReviewFormState> {
  return run('save review draft', async (who) => {
    const user = (who.current = await requireUser());
    const { updatedAt } = updateReviewDraft(getDb(), user, idOf(reviewId), input);
    return { ok: true, message: 'Saved.', savedAt: updatedAt.toISOString() };
  });
}

async function transition(action: WorkflowAction, reviewId: unknown, comment: string | null, after: (o: TransitionOutcome) => string): Promise<ReviewFormState> {
  return run(`review ${action}`, async (who) => {
    const user = (who.current = await requireUser());
    const db = getDb();
    const outcome = transitionReview(db, user, idOf(reviewId), action, comment);
    await notifyTransition(db, outcome, user);
    if (action === 'publish' || action === 'retract') {
      revalidatePath('/reviews');
      revalidatePath(`/reviews/${outcome.slug}`);
    }
    return after(outcome);
  });
}

const toWrite = (o: TransitionOutcome) => `/write/${o.reviewId}`;
const toDesk = (o: TransitionOutcome) => `/desk/reviews/${o.reviewId}`;

export async function submitReviewAction(reviewId: unknown): Promise<ReviewFormState> {
  return transition('submit', reviewId, null, toWrite);
}

export async function withdrawReviewAction(reviewId: unknown): Promise<ReviewFormState> {
  return transition('withdraw', reviewId, null, toWrite);
}

export async function startCorrectionAction(reviewId: unknown): Promise<ReviewFormState> {
  return transition('start-correction', reviewId, null, toWrite);
}

export async function requestChangesAction(reviewId: unknown, input: unknown): Promise<ReviewFormState> {
  return run('review request-changes', async (who) => {
    who.current = await requireUser();
    const { comment } = parseWith(requestChangesSchema, input);
    return transition('request-changes', reviewId, comment, toDesk);
  });
}

export async function approveReviewAction(reviewId: unknown): Promise<ReviewFormState> {
  return transition('approve', reviewId, null, toDesk);
}

export async function publishReviewAction(reviewId: unknown): Promise<ReviewFormState> {
  return transition('publish', reviewId, null, toDesk);
}

export async function retractReviewAction(reviewId: unknown, input: unknown): Promise<ReviewFormState> {
  return run('review retract', async (who) => {
    who.current = await requireUser();
    const { note } = parseWith(retractSchema, input);
    return transition('retract', reviewId, note, toDesk);
  });
}

/** Saves the signed-in user's own mail switches. */
export async function saveNotificationSettingsAction(input: unknown): Promise<ReviewFormState> {
  return run('save notification settings', async (who) => {
    const user = (who.current = await requireUser());
    saveNotificationSettings(getDb(), user, input);
    return { ok: true, message: 'Saved.' };
  });
}
