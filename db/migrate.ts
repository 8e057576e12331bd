/// Applies the committed migrations in drizzle/ to DATABASE_URL (run by lib/ops scripts
/// with `node --import tsx db/migrate.ts`). Already-applied migrations are skipped.
import path from "node:path";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import { closeDb, db } from "./client";

async function main(): Promise<void> {
  await migrate(db(), { migrationsFolder: path.join(__dirname, "..", "drizzle") });
}

main()
  .then(() => closeDb())
  .catch(async (error: unknown) => {
    console.error("migrate: failed:", error instanceof Error ? error.message : error);
    await closeDb();
    process.exit(1);
  });
