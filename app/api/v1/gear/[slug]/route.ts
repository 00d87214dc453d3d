import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { findEditableGear, updateGear } from '@/db/gear';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler, readJson } from '@/lib/http/api';
import { gearPath } from '@/lib/gear/paths';

export const dynamic = 'force-dynamic';

/** One item's summary (lib/browse/contract.ts GearSummary); 404 when unknown or not visible to the caller. */
export { handleGearItem as GET } from '@/lib/browse/handlers';

/**
 * Change a gear item: JSON body of `gearPatchSchema` (any subset of the editable fields). 404 when the
 * caller may not see it, 403 when not theirs, 409 while in review, 422 for invalid fields. An approved
 * item keeps its public figures; the change waits for approval (`pending: true`).
 */
export const PATCH = apiHandler(async (request: Request, context: { params: Promise<{ slug: string }> }) => {
  const { slug } = await context.params;
  const user = await requireApiCaller(request, { scope: 'write' });
  findEditableGear(getDb(), slug, user); // 404/403 before the body is read (status table order)
  const body = await readJson(request);
  const result = updateGear(getDb(), user, slug, body);
  return NextResponse.json({ item: { slug: result.slug, pending: result.pending, path: gearPath(result.slug) } });
});
