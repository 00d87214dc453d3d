import { NextResponse } from 'next/server';
import { openApiDocument } from '@/lib/openapi/document';

export const dynamic = 'force-static';

/** The OpenAPI 3.1 document of /api/v1 (public). */
export function GET() {
  return NextResponse.json(openApiDocument(), { headers: { 'Cache-Control': 'public, max-age=60' } });
}
