import { NextResponse } from 'next/server';
import packageJson from '@/package.json' with { type: 'json' };

export const dynamic = 'force-dynamic';

export function GET() {
  return NextResponse.json({ ok: true, version: packageJson.version });
}
