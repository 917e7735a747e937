import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  // connect-pg-simple owns the session table; keep drizzle-kit away from it.
  tablesFilter: ['!session'],
  // drizzle-kit reads and changes the schema: the owner's login, never the application's.
  dbCredentials: { url: process.env.DATABASE_OWNER_URL ?? 'postgres://postgres@127.0.0.1:54329/breakover' },
});
