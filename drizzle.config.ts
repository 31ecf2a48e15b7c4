// drizzle-kit configuration: schema in db/schema.ts, generated SQL migrations committed in db/migrations.
import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  schema: './db/schema.ts',
  out: './db/migrations',
  schemaFilter: ['public'],
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/fluxfolio' },
});
