// Apply the committed SQL migrations in db/migrations (drizzle-orm's postgres-js migrator) to DATABASE_URL.
// CLI: `npm run db:migrate [-- --create | --recreate]`; both start scripts and the test harness use it.
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate } from 'drizzle-orm/postgres-js/migrator';
import postgres from 'postgres';
import { ensureDatabase } from './ensure-database';

export const MIGRATIONS_FOLDER = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');
const DEFAULT_DATABASE_URL = 'postgres://postgres@127.0.0.1:54329/fluxfolio';

/**
 * Apply every pending migration to the database at `url` (already applied ones are skipped; drizzle records
 * them in `drizzle.__drizzle_migrations`).
 *
 * @param url - postgres:// URL of the target database
 * @example
 * await migrateDatabase(process.env.DATABASE_URL!);
 */
export async function migrateDatabase(url: string): Promise<void> {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    await migrate(drizzle(sql), { migrationsFolder: MIGRATIONS_FOLDER });
  } finally {
    await sql.end({ timeout: 5 });
  }
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
  const url = process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
  if (argv.includes('--create') || argv.includes('--recreate')) {
    const created = await ensureDatabase(url, { recreate: argv.includes('--recreate') });
    if (created) console.log(`[migrate] created database ${redact(url)}`);
  }
  await migrateDatabase(url);
  console.log(`[migrate] ${redact(url)} is up to date`);
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
