import 'server-only';
import { notFound } from 'next/navigation';
import type { Db } from '@/db';
import type { Actor } from '@/db/gear';
import { getFieldTestView, type FieldTestView } from '@/db/field-tests-view';
import { AppError } from '@/lib/http/errors';

/** The view for a page, or the 404 page when the viewer may not see the test. */
export function loadFieldTestView(db: Db, id: string, viewer: Actor | null): FieldTestView {
  try {
    return getFieldTestView(db, id, viewer);
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') notFound();
    throw e;
  }
}
