import { NextResponse } from 'next/server';
import packageJson from '@/package.json' with { type: 'json' };
import { getDb } from '@/db';

export const dynamic = 'force-dynamic';

export function GET() {
  let db = 'ok';
  try {
    const row = getDb().$client.prepare('select 1 as one').get() as { one: number };
    if (row.one !== 1) db = 'error';
  } catch {
    db = 'error';
  }
  const ok = db === 'ok';
  return NextResponse.json({ ok, db, version: packageJson.version }, { status: ok ? 200 : 503, headers: { 'Cache-Control': 'no-store' } });
}
