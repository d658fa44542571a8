// Apply db/migrations to the database named by DATABASE_URL (idempotent).
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { db, closeDb } from "@/db/client";

await migrate(db(), { migrationsFolder: "db/migrations" });
await closeDb();
console.log("• Database migrated");
