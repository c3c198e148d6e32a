import { defineConfig } from 'drizzle-kit';

// Scripts pass DATABASE_URL; `astro:env` cannot run here.
export default defineConfig({
  dialect: 'postgresql',
  schema: './src/db/schema.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.DATABASE_URL ?? 'postgres://localhost/benchwright' },
  strict: true,
});
