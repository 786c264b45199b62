import { z } from "zod";

/** Environment → typed configuration, validated once at start-up. */
const EnvSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().url({ message: "DATABASE_URL must be a postgres:// URL" }),
  HOST: z.string().default("127.0.0.1"),
  PORT: z.coerce.number().int().min(0).max(65535).default(5180),
  PUBLIC_URL: z.string().url().optional(),
  SESSION_SECRET: z.string().min(16, "SESSION_SECRET must be at least 16 characters").optional(),
  COOKIE_SECURE: z.enum(["auto", "true", "false"]).default("auto"),
  TRUST_PROXY: z.string().optional(),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default("Rhomb <no-reply@rhomb.localhost>"),
  /** "1": without SMTP_URL, catch mail in a fake SMTP server inside this process (start, dev, test set it). */
  RHOMB_FAKE_SMTP: z.enum(["0", "1"]).default("0"),
  RHOMB_FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  RHOMB_STATIC_DIR: z.string().default("dist/client"),
  RHOMB_IN_PROCESS_WORKERS: z.coerce.number().int().min(0).max(16).default(1),
  /** Batch-file jobs one `npm run worker` process runs at once (its Monte Carlo threads are shared). */
  RHOMB_WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(32).default(4),
  /** A job still running after this long counts as lost (e.g. its worker died) and is retried. */
  RHOMB_JOB_TIMEOUT_SECONDS: z.coerce.number().int().min(2).max(3600).default(300),
});

export type Config = z.infer<typeof EnvSchema> & { publicUrl: string; sessionSecret: string };

let cached: Config | undefined;

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = EnvSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join("\n")}`);
  }
  const c = parsed.data;
  if (c.NODE_ENV === "production" && !c.SESSION_SECRET) {
    throw new Error("Invalid configuration:\n  SESSION_SECRET: required in production");
  }
  return {
    ...c,
    publicUrl: c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}`,
    // Outside production a fixed development secret is acceptable: the start script passes a
    // per-checkout secret from .rhomb/ so sign-ins survive restarts.
    sessionSecret: c.SESSION_SECRET ?? "rhomb-development-secret-not-for-production",
  };
}

export function config(): Config {
  cached ??= loadConfig();
  return cached;
}

/** Tests change the environment between suites; this forgets the cached copy. */
export function resetConfigForTests(): void {
  cached = undefined;
}
