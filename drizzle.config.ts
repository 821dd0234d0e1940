import { defineConfig } from "drizzle-kit";

// Used only to generate migrations (`npm run db:generate`); they are applied by scripts/migrate.ts.
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema/index.ts",
  out: "./drizzle",
  strict: true,
});
