// The app role's rights in a migrated database, granted by the owner role that ran the migrations: rows (not tables)
// in public, and pg-boss's schema as its own, because pg-boss adds a table per queue. Never the right to alter ours.
import PgBoss from 'pg-boss';
import postgres from 'postgres';

const ROLE_NAME = /^[a-z_][a-z0-9_]{0,62}$/;
const QUEUE_SCHEMA = 'pgboss';

/** A role name checked against a plain pattern and double-quoted, so that it can go into DDL. */
export function quoteRole(name: string): string {
  if (!ROLE_NAME.test(name)) throw new RangeError(`role name '${name}' must match ${ROLE_NAME}`);
  return `"${name}"`;
}

/** The user name of a postgres:// URL (decoded), or '' when it has none. */
export function roleOf(url: string): string {
  return decodeURIComponent(new URL(url).username);
}

/** Statements that hand every object of pg-boss's schema (owned by someone else) to `role`. */
async function queueSchemaTransfers(sql: postgres.Sql, role: string): Promise<string[]> {
  const rows = await sql<{ statement: string }[]>`
    SELECT format('ALTER SCHEMA %I OWNER TO %I', n.nspname, ${role}::text) AS statement
      FROM pg_namespace n WHERE n.nspname = ${QUEUE_SCHEMA} AND pg_get_userbyid(n.nspowner) <> ${role}
    UNION ALL
    SELECT format('ALTER %s %s OWNER TO %I', CASE c.relkind WHEN 'S' THEN 'SEQUENCE' WHEN 'v' THEN 'VIEW' ELSE 'TABLE' END,
                  c.oid::regclass, ${role}::text)
      FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
     WHERE n.nspname = ${QUEUE_SCHEMA} AND c.relkind IN ('r', 'p', 'S', 'v') AND pg_get_userbyid(c.relowner) <> ${role}
       AND (c.relkind <> 'S' OR NOT EXISTS (SELECT 1 FROM pg_depend d WHERE d.classid = 'pg_class'::regclass AND d.objid = c.oid AND d.objsubid = 0
                         AND d.refclassid = 'pg_class'::regclass AND d.deptype IN ('a', 'i')))
    UNION ALL
    SELECT format('ALTER TYPE %s OWNER TO %I', t.oid::regtype, ${role}::text)
      FROM pg_type t JOIN pg_namespace n ON n.oid = t.typnamespace
     WHERE n.nspname = ${QUEUE_SCHEMA} AND t.typtype IN ('e', 'd') AND pg_get_userbyid(t.typowner) <> ${role}
    UNION ALL
    SELECT format('ALTER ROUTINE %s OWNER TO %I', p.oid::regprocedure, ${role}::text)
      FROM pg_proc p JOIN pg_namespace n ON n.oid = p.pronamespace
     WHERE n.nspname = ${QUEUE_SCHEMA} AND p.prokind IN ('f', 'p') AND pg_get_userbyid(p.proowner) <> ${role}`;
  return rows.map((row) => row.statement);
}

/**
 * Give the app role what it needs and nothing more: CONNECT, SELECT/INSERT/UPDATE/DELETE on every table of public
 * (also on tables later migrations add), USAGE/SELECT on its sequences, and pg-boss's schema, installed here by the
 * owner and then handed over (the app role itself may not create schemas). The owner role must be able to SET ROLE
 * to the app role (scripts/pg.sh grants that); a single-role deployment skips all of this.
 *
 * @param ownerUrl - postgres:// URL of the migrated database, as the owner role
 * @param appRole - the role the app, the worker and the seed connect as
 * @example
 * await grantAppRole(process.env.DATABASE_OWNER_URL!, 'fluxfolio_app');
 */
export async function grantAppRole(ownerUrl: string, appRole: string): Promise<void> {
  const app = quoteRole(appRole);
  if (appRole === roleOf(ownerUrl)) return;
  const sql = postgres(ownerUrl, { max: 1, onnotice: () => {} });
  try {
    const [{ db }] = await sql<{ db: string }[]>`SELECT current_database() AS db`;
    const database = `"${db.replace(/"/g, '""')}"`;
    await sql.begin(async (tx) => {
      await tx.unsafe(`GRANT CONNECT ON DATABASE ${database} TO ${app}`);
      await tx.unsafe(`GRANT USAGE ON SCHEMA public TO ${app}`);
      await tx.unsafe(`GRANT SELECT, INSERT, UPDATE, DELETE ON ALL TABLES IN SCHEMA public TO ${app}`);
      await tx.unsafe(`GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA public TO ${app}`);
      await tx.unsafe(`ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT SELECT, INSERT, UPDATE, DELETE ON TABLES TO ${app}`);
      await tx.unsafe(`ALTER DEFAULT PRIVILEGES IN SCHEMA public GRANT USAGE, SELECT ON SEQUENCES TO ${app}`);
    });
    const [{ installed }] = await sql<{ installed: string | null }[]>`SELECT to_regclass('pgboss.version')::text AS installed`;
    if (!installed) await installQueueSchema(ownerUrl);
    const transfers = await queueSchemaTransfers(sql, appRole);
    if (transfers.length === 0) return;
    await sql.begin(async (tx) => {
      // A schema's new owner needs CREATE on the database; held only inside this transaction.
      await tx.unsafe(`GRANT CREATE ON DATABASE ${database} TO ${app}`);
      for (const statement of transfers) await tx.unsafe(statement);
      await tx.unsafe(`REVOKE CREATE ON DATABASE ${database} FROM ${app}`);
    });
  } finally {
    await sql.end({ timeout: 5 });
  }
}

/** Let pg-boss create (or migrate) its schema, as the connecting role. */
async function installQueueSchema(url: string): Promise<void> {
  const boss = new PgBoss({ connectionString: url, supervise: false, schedule: false, max: 1, application_name: 'fluxfolio-migrate' });
  boss.on('error', (error) => console.error('[migrate] pg-boss:', error.message));
  await boss.start();
  await boss.stop({ graceful: false, wait: true });
}
