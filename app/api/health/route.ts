// GET: liveness plus a database round trip; 503 when PostgreSQL does not answer. No session needed.
// Used by scripts and monitors to see that the server and its database are up.
import { sql } from 'drizzle-orm';
import { db } from '@/db';

export const dynamic = 'force-dynamic';

export async function GET(): Promise<Response> {
  try {
    const rows = await db.execute<{ now: string }>(sql`select now() as now`);
    return Response.json({ ok: true, database: 'up', time: rows[0]?.now ?? null });
  } catch (error) {
    console.error(error);
    return Response.json({ ok: false, database: 'down', error: 'The database does not answer' }, { status: 503 });
  }
}
