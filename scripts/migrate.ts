import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";
import { env } from "@/lib/env";

const pool = new Pool({ connectionString: env.DATABASE_URL, max: 1 });
migrate(drizzle(pool), { migrationsFolder: "drizzle" })
  .then(() => pool.end())
  .catch((error) => {
    console.error(error);
    process.exit(1);
  });
