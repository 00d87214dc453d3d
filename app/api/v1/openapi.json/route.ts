import { NextResponse } from 'next/server';
import { openApiDocument } from '@/lib/openapi/document';

// Dynamic so our Cache-Control is sent as written (the document itself is built once per process).
export const dynamic = 'force-dynamic';

/** The OpenAPI 3.1 document of /api/v1 (public). */
export function GET() {
  return NextResponse.json(openApiDocument(), { headers: { 'Cache-Control': 'public, max-age=60' } });
}
