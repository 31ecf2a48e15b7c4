// Create (or drop and recreate) the database named in a PostgreSQL URL, through the same server's `postgres`
// maintenance database. Works for any server DATABASE_URL points at, not only the local one.
import postgres from 'postgres';

const DATABASE_NAME = /^[A-Za-z_][A-Za-z0-9_]{0,62}$/;

/** The database name of a postgres:// URL, validated so that it can be quoted safely. */
export function databaseNameOf(url: string): string {
  const name = decodeURIComponent(new URL(url).pathname.replace(/^\//, ''));
  if (!DATABASE_NAME.test(name)) {
    throw new RangeError(`database name '${name}' in the URL must match ${DATABASE_NAME} (letters, digits, _)`);
  }
  return name;
}

/** The same server's maintenance database URL (`/postgres`). */
export function maintenanceUrl(url: string): string {
  const u = new URL(url);
  u.pathname = '/postgres';
  return u.toString();
}

/**
 * Make sure the database of `url` exists; with `recreate`, drop it first (closing other sessions: PostgreSQL ≥ 13).
 *
 * @param url - postgres:// URL of the target database
 * @param options.recreate - drop and create again (for the test database)
 * @returns whether the database was created by this call
 * @example
 * await ensureDatabase('postgres://postgres@127.0.0.1:54329/fluxfolio_scratch'); // returns true the first time
 */
export async function ensureDatabase(url: string, { recreate = false } = {}): Promise<boolean> {
  const name = databaseNameOf(url);
  if (['postgres', 'template0', 'template1'].includes(name)) throw new RangeError(`refusing to manage system database '${name}'`);
  const sql = postgres(maintenanceUrl(url), { max: 1, onnotice: () => {} });
  try {
    if (recreate) await sql.unsafe(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    const found = await sql`SELECT 1 FROM pg_database WHERE datname = ${name}`;
    if (found.length > 0) return false;
    try {
      await sql.unsafe(`CREATE DATABASE "${name}"`);
    } catch (error) {
      // Another process created it between the check and the CREATE (42P04 duplicate_database): fine.
      if ((error as { code?: string }).code === '42P04') return false;
      throw error;
    }
    return true;
  } finally {
    await sql.end({ timeout: 5 });
  }
}

/**
 * Drop the database of `url` if it exists (closing other sessions).
 *
 * @example
 * await dropDatabase('postgres://postgres@127.0.0.1:54329/fluxfolio_scratch');
 */
export async function dropDatabase(url: string): Promise<void> {
  const name = databaseNameOf(url);
  if (['postgres', 'template0', 'template1'].includes(name)) throw new RangeError(`refusing to drop system database '${name}'`);
  const sql = postgres(maintenanceUrl(url), { max: 1, onnotice: () => {} });
  try {
    await sql.unsafe(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  } finally {
    await sql.end({ timeout: 5 });
  }
}
