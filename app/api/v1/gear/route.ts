import { NextResponse } from 'next/server';
import { getDb } from '@/db';
import { createGear } from '@/db/gear';
import { requireApiCaller } from '@/lib/auth/api-caller';
import { apiHandler, readJson } from '@/lib/http/api';
import { gearPath } from '@/lib/gear/paths';

export const dynamic = 'force-dynamic';

/** Browse the catalog (query parameters and answer: lib/browse/query.ts, lib/browse/contract.ts). */
export { handleGearList as GET } from '@/lib/browse/handlers';

/** Create a draft gear item: JSON body of `gearInputSchema` (lib/gear/schemas.ts); 201 with its slug and page. */
export const POST = apiHandler(async (request: Request) => {
  const user = await requireApiCaller(request, { scope: 'write', role: 'reviewer' });
  const body = await readJson(request);
  const { slug } = createGear(getDb(), user, body);
  const path = gearPath(slug);
  return NextResponse.json({ item: { slug, status: 'draft', path } }, { status: 201, headers: { Location: path } });
});
