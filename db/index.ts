// The one PostgreSQL client (postgres.js) and Drizzle instance, reused across dev reloads via globalThis.
// DATABASE_URL wins (`scripts/pg.sh url` prints the local one, as the app role); the default has no password.
import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import * as schema from './schema';

export const DEFAULT_DATABASE_URL = 'postgres://fluxfolio_app@127.0.0.1:54329/fluxfolio';

export function databaseUrl(): string {
  return process.env.DATABASE_URL || DEFAULT_DATABASE_URL;
}

const globalForDb = globalThis as unknown as { fluxfolioSql?: postgres.Sql };

export const sqlClient: postgres.Sql =
  globalForDb.fluxfolioSql ?? postgres(databaseUrl(), { max: 10, onnotice: () => {} });
if (process.env.NODE_ENV !== 'production') globalForDb.fluxfolioSql = sqlClient;

export const db = drizzle(sqlClient, { schema });
export type Db = typeof db;
export { schema };
