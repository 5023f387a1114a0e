import { z } from "zod";

/**
 * Process environment, parsed once. Every module that needs configuration imports
 * `env` from here instead of reading `process.env` directly.
 */
const envSchema = z.object({
  DATABASE_URL: z.string().url("DATABASE_URL must be a postgres:// URL"),
  AUTH_SECRET: z.string().min(16).default("seriatim-local-development-secret-change-me"),
  /** The origin the app advertises in e-mailed links, e.g. http://127.0.0.1:3000. */
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  /** SMTP server for outgoing mail: the local fake in development, a hosted service in production. */
  SMTP_URL: z.string().default("smtp://127.0.0.1:2525"),
  MAIL_FROM: z.string().default("Seriatim <no-reply@seriatim.local>"),
  /** Failed password sign-ins allowed per address within the window before 429. */
  SIGNIN_MAX_FAILURES: z.coerce.number().int().positive().default(10),
  SIGNIN_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
});

export type Env = z.infer<typeof envSchema>;

function parseEnv(): Env {
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join("\n")}`);
  }
  return parsed.data;
}

let cached: Env | undefined;

/** Parsed environment; parsed lazily so `next build` does not need a database URL. */
export function getEnv(): Env {
  cached ??= parseEnv();
  return cached;
}
