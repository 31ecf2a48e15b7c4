// The app connects as a role that can read and write rows but cannot alter tables or the snapshot triggers, and
// PostgreSQL asks for a password on TCP (scripts/pg.sh, db/app-role.ts). Owner-side checks use DATABASE_OWNER_URL.
import postgres from 'postgres';
import { afterAll, describe, expect, it } from 'vitest';
import { databaseUrl } from '@/db';
import { ownerDatabaseUrl } from '../helpers/db';

const app = postgres(databaseUrl(), { max: 1, onnotice: () => {} });
const owner = postgres(ownerDatabaseUrl(), { max: 1, onnotice: () => {} });

afterAll(async () => {
  await app.end({ timeout: 5 });
  await owner.end({ timeout: 5 });
});

/** The PostgreSQL error a statement run as the app role fails with (the test fails when it succeeds). */
async function refusedToApp(statement: string): Promise<{ code?: string; message: string }> {
  return app.unsafe(statement).then(
    () => {
      throw new Error(`the app role was allowed to run: ${statement}`);
    },
    (error: { code?: string; message: string }) => error,
  );
}

describe('database roles', () => {
  it('runs the app and the migrations as two different, unprivileged roles', async () => {
    const [appRole] = await app`SELECT current_user AS name, rolsuper, rolcreatedb, rolcreaterole, rolbypassrls
                                 FROM pg_roles WHERE rolname = current_user`;
    const [ownerRole] = await owner`SELECT current_user AS name, rolsuper FROM pg_roles WHERE rolname = current_user`;
    expect(appRole.name).not.toBe(ownerRole.name);
    expect(appRole).toMatchObject({ rolsuper: false, rolcreatedb: false, rolcreaterole: false, rolbypassrls: false });
    expect(ownerRole.rolsuper).toBe(false);
    const [table] = await owner`SELECT tableowner FROM pg_tables WHERE schemaname = 'public' AND tablename = 'snapshots'`;
    expect(table.tableowner).toBe(ownerRole.name);
  });

  it('refuses to let the app role switch off, drop or outflank the snapshot triggers', async () => {
    for (const statement of [
      'ALTER TABLE snapshots DISABLE TRIGGER ALL',
      'ALTER TABLE snapshots DISABLE TRIGGER snapshots_immutable',
      'DROP TRIGGER snapshots_immutable ON snapshots',
      'CREATE OR REPLACE FUNCTION snapshots_refuse_change() RETURNS trigger AS $$ BEGIN RETURN NEW; END; $$ LANGUAGE plpgsql',
      'TRUNCATE snapshots CASCADE',
    ]) {
      const error = await refusedToApp(statement);
      expect(error.code, `${statement}: ${error.message}`).toBe('42501');
      expect(error.message).toMatch(/must be owner|permission denied/);
    }
    const [trigger] = await owner`SELECT tgenabled FROM pg_trigger WHERE tgname = 'snapshots_immutable'`;
    expect(trigger.tgenabled).toBe('O');
  });

  it('refuses schema changes to the app role: new columns, tables and schemas', async () => {
    for (const statement of [
      'ALTER TABLE users ADD COLUMN sneaky integer',
      'ALTER TABLE snapshots ADD COLUMN sneaky integer',
      'CREATE TABLE public.sneaky (id integer)',
      'CREATE SCHEMA sneaky',
    ]) {
      const error = await refusedToApp(statement);
      expect(error.code, `${statement}: ${error.message}`).toBe('42501');
    }
  });

  it('lets the app role own only the queue schema (pg-boss adds a table per queue)', async () => {
    const rows = await owner<{ nspname: string; owner: string }[]>`
      SELECT nspname, pg_get_userbyid(nspowner) AS owner FROM pg_namespace WHERE nspname IN ('pgboss', 'public', 'drizzle')`;
    const [{ name: appName }] = await app`SELECT current_user AS name`;
    const owners = Object.fromEntries(rows.map((r) => [r.nspname, r.owner]));
    expect(owners.pgboss).toBe(appName);
    expect(owners.drizzle).not.toBe(appName);
    expect(owners.public).not.toBe(appName);
    const [{ n }] = await app`SELECT count(*)::int AS n FROM pgboss.queue`;
    expect(n).toBeGreaterThanOrEqual(0);
  });

  it('refuses a TCP connection without a password or with a wrong one', async () => {
    for (const password of ['', 'not-the-password']) {
      const url = new URL(databaseUrl());
      url.password = password;
      const client = postgres(url.toString(), { max: 1, connect_timeout: 10, onnotice: () => {} });
      try {
        await expect(client`SELECT 1`).rejects.toThrow(/password/i);
      } finally {
        await client.end({ timeout: 1 });
      }
    }
    const superuser = new URL(databaseUrl());
    superuser.username = 'postgres';
    superuser.password = '';
    const client = postgres(superuser.toString(), { max: 1, connect_timeout: 10, onnotice: () => {} });
    try {
      await expect(client`SELECT 1`).rejects.toThrow(/password/i);
    } finally {
      await client.end({ timeout: 1 });
    }
  });
});
