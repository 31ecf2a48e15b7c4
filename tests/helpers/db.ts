// Test database access: the app's Drizzle instance on DATABASE_URL (the test database made by scripts/test.sh), a guard
// against the dev database, and unique tags for e-mails and slugs so rows of different tests and runs never collide.
import { databaseUrl, db } from '@/db';

/** The test database as the owner role (DATABASE_OWNER_URL from scripts/test.sh), for checks that need the owner. */
export function ownerDatabaseUrl(): string {
  return process.env.DATABASE_OWNER_URL || databaseUrl();
}

/** The dev database that tests must never write to. */
const DEV_DATABASE_NAME = 'fluxfolio';

/** Name of the database the tests use (from DATABASE_URL). */
export function testDatabaseName(): string {
  return decodeURIComponent(new URL(databaseUrl()).pathname.slice(1));
}

if (testDatabaseName() === DEV_DATABASE_NAME && process.env.FLUXFOLIO_ALLOW_DEV_DB !== '1') {
  throw new Error(
    'tests/helpers/db: DATABASE_URL points at the dev database "fluxfolio". Run the tests through `npm test` ' +
      '(it creates fluxfolio_test), or set DATABASE_URL to a test database.',
  );
}

/** The Drizzle instance the tests share with the code under test (same pool). */
export const testDb = db;

/** A tag unique to this test process: a base-36 time stamp and the pid. Rows from earlier runs never collide. */
export const RUN_TAG = `${Date.now().toString(36)}${process.pid.toString(36)}`;
let counter = 0;

/** A fresh unique suffix such as `m3x1k2a9-7`. */
export function uniqueTag(): string {
  counter += 1;
  return `${RUN_TAG}-${counter}`;
}
