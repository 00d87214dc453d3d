import 'server-only';
import { forbidden, notFound } from 'next/navigation';
import { AppError } from '@/lib/http/errors';

/** Runs a gear read for a page: 404 and 403 AppErrors become the real not-found and forbidden pages. */
export function orPageError<T>(read: () => T): T {
  try {
    return read();
  } catch (error) {
    if (error instanceof AppError && error.code === 'not_found') notFound();
    if (error instanceof AppError && error.code === 'forbidden') forbidden();
    throw error;
  }
}
