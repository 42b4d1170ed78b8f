import { defineConfig } from 'drizzle-kit'

// Migrations are generated from the schema (npx drizzle-kit generate) and committed; never edited by hand.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/database/schema.ts',
  out: './server/database/migrations',
  dbCredentials: { url: process.env.NUXT_DATABASE_URL ?? '' },
})
