// Apply db/migrations to the database named by DATABASE_URL (idempotent), then let pg-boss create
// or migrate the job queue's own schema (JOBS_SCHEMA, default "pgboss") and our queues.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { db, closeDb } from "@/db/client";
import { installJobStore } from "@/lib/jobs/boss";

await migrate(db(), { migrationsFolder: "db/migrations" });
await installJobStore();
await closeDb();
console.log("• Database migrated (and the job queue's schema)");
