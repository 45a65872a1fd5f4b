import { z } from "zod";

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().url().default("postgres://postgres@127.0.0.1:55432/vicinal"),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(200).default(20),
  AUTH_SECRET: z.string().min(16).default("development-only-secret-change-me"),
  AUTH_URL: z.string().url().default("http://localhost:3000"),
  APP_URL: z.string().url().default("http://localhost:3000"),
  S3_ENDPOINT: z.string().url().optional(),
  S3_PUBLIC_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("vicinal"),
  S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
  S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default("true").transform((v) => v === "true"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().default(1025),
  SMTP_SECURE: z.enum(["true", "false"]).default("false").transform((v) => v === "true"),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default("Vicinal <no-reply@vicinal.local>"),
  MAIL_WEB_URL: z.string().url().optional(),
  UPLOAD_MAX_BYTES: z.coerce.number().int().positive().default(2 * 1024 ** 3),
  IMPORT_MAX_COLUMNS: z.coerce.number().int().positive().default(2048),
  /** A running import whose worker has not beaten for this long is taken as dead: its job is failed, so it is retried. */
  IMPORT_STALL_SECONDS: z.coerce.number().int().min(5).default(120),
  PRESIGN_SECONDS: z.coerce.number().int().min(30).max(3600).default(300),
  LEASE_SECONDS: z.coerce.number().int().min(30).max(86_400).default(600),
  SIGNIN_LIMIT_PER_ACCOUNT: z.coerce.number().int().positive().default(10),
  SIGNIN_LIMIT_PER_IP: z.coerce.number().int().positive().default(50),
  TOKEN_LIMIT_PER_MINUTE: z.coerce.number().int().positive().default(6000),
});

export type Env = z.infer<typeof envSchema>;

function parseEnv(): Env {
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Invalid environment configuration:\n${problems}`);
  }
  return parsed.data;
}

/** The parsed configuration; the only reader of process.env in the app. */
export const env: Env = parseEnv();
