import { NextResponse } from 'next/server';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/lib/db/connection';
import { pendingMigrations } from '@/lib/db/migrator';

export const dynamic = 'force-dynamic';

/** Liveness and readiness: database reachable and no migration pending. Public, no secrets. */
export async function GET() {
  try {
    const sequelize = getSequelize();
    await sequelize.query('SELECT 1', { type: QueryTypes.SELECT });
    const pending = await pendingMigrations(sequelize);
    const ok = pending.length === 0;
    return NextResponse.json({ ok, db: 'up', migrations: ok ? 'current' : { pending } }, { status: ok ? 200 : 503 });
  } catch (err) {
    console.error('health check failed', err);
    return NextResponse.json({ ok: false, db: 'down', migrations: 'unknown' }, { status: 503 });
  }
}
