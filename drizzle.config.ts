import { defineConfig } from "drizzle-kit";

// drizzle-kit only generates SQL here (`npm run db:generate`); migrations are applied by
// db/migrate.ts through postgres.js, so drizzle-kit's own driver choice (it would pick `pg`,
// which pg-boss brings) never touches the database.
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./drizzle",
  strict: true,
  verbose: true,
});
