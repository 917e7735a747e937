import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  // connect-pg-simple owns the session table; keep drizzle-kit away from it.
  tablesFilter: ['!session'],
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/breakover' },
});
