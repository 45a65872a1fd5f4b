// Run by the start and test scripts after the services are up: migrations, the bucket and its CORS rule, the job queue schema.
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";
import { env } from "@/lib/env";
import { createWorkerBoss } from "@/lib/jobs/boss";
import { ensureBucket } from "@/lib/storage/s3";

async function main() {
  const pool = new Pool({ connectionString: env.DATABASE_URL, max: 1 });
  await migrate(drizzle(pool), { migrationsFolder: "drizzle" });
  await pool.end();
  const origin = new URL(env.APP_URL).origin;
  await ensureBucket([origin, origin.replace("localhost", "127.0.0.1")]);
  const boss = await createWorkerBoss();
  await boss.stop({ graceful: false, wait: true });
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
