import { NextResponse } from 'next/server';
import { checkDatabase } from '@/db/queries/health';

export const dynamic = 'force-dynamic';

/** Liveness of the app and its database, for load balancers and the start scripts. */
export async function GET(): Promise<NextResponse> {
  const db = await checkDatabase();
  if (db.ok) return NextResponse.json({ db: 'ok' }, { status: 200, headers: { 'Cache-Control': 'no-store' } });
  return NextResponse.json(
    { db: 'unavailable', error: `database unreachable: ${db.reason}` },
    { status: 503, headers: { 'Cache-Control': 'no-store' } },
  );
}
