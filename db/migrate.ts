// Apply the committed SQL migrations in db/migrations (drizzle-orm's postgres-js migrator) as the owner role
// (DATABASE_OWNER_URL, else DATABASE_URL), then grant the app role of DATABASE_URL its rights. CLI: `npm run db:migrate`.
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate } from 'drizzle-orm/postgres-js/migrator';
import postgres from 'postgres';
import { grantAppRole, roleOf } from './app-role';
import { ensureDatabase } from './ensure-database';

export const MIGRATIONS_FOLDER = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');
const DEFAULT_DATABASE_URL = 'postgres://fluxfolio_owner@127.0.0.1:54329/fluxfolio';

/**
 * Apply every pending migration to the database at `url` (already applied ones are skipped; drizzle records
 * them in `drizzle.__drizzle_migrations`), then grant `appRole` (when given and not the owner) its rights.
 *
 * @param url - postgres:// URL of the target database, as the role that owns the tables
 * @param options.appRole - the role the app connects as (see db/app-role.ts)
 * @example
 * await migrateDatabase(process.env.DATABASE_OWNER_URL!, { appRole: 'fluxfolio_app' });
 */
export async function migrateDatabase(url: string, { appRole }: { appRole?: string } = {}): Promise<void> {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    await migrate(drizzle(sql), { migrationsFolder: MIGRATIONS_FOLDER });
  } finally {
    await sql.end({ timeout: 5 });
  }
  if (appRole) await grantAppRole(url, appRole);
}

function redact(url: string): string {
  return url.replace(/\/\/([^:@/]+):[^@/]*@/, '//$1:***@');
}

async function main(argv: string[]): Promise<number> {
  const unknown = argv.filter((a) => !['--create', '--recreate'].includes(a));
  if (unknown.length > 0) {
    console.error(`db/migrate: unknown option ${unknown.join(' ')} (use --create or --recreate)`);
    return 2;
  }
  const url = process.env.DATABASE_OWNER_URL || process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
  const appUrl = process.env.DATABASE_URL;
  const appRole = appUrl && roleOf(appUrl) !== roleOf(url) ? roleOf(appUrl) : undefined;
  if (argv.includes('--create') || argv.includes('--recreate')) {
    const created = await ensureDatabase(url, { recreate: argv.includes('--recreate') });
    if (created) console.log(`[migrate] created database ${redact(url)}`);
  }
  await migrateDatabase(url, { appRole });
  console.log(`[migrate] ${redact(url)} is up to date${appRole ? `; ${appRole} may read and write rows` : ''}`);
  return 0;
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  main(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (error: unknown) => {
      console.error(`[migrate] failed: ${error instanceof Error ? error.message : String(error)}`);
      process.exit(1);
    },
  );
}
