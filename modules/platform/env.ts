import { z } from "zod";

// The environment is read and validated once, here; nothing else reads process.env.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.string().min(1).default("postgres://plinthwise@127.0.0.1:54329/plinthwise"),
  SESSION_SECRET: z.string().min(32, "SESSION_SECRET must be at least 32 characters").optional(),
  SMTP_URL: z.string().min(1).default("smtp://127.0.0.1:2525"),
  MAIL_FROM: z.string().min(3).default("Plinthwise <desk@plinthwise.invalid>"),
  APP_URL: z.string().url().default("http://localhost:3000"),
  PLINTH_DEMO: z.enum(["0", "1"]).default("0"),
  // How many proxies in front of the app append to X-Forwarded-For ("0": none, the
  // header is ignored; "1": one load balancer; "2": CDN then balancer, ...).
  TRUST_PROXY: z.string().regex(/^[0-9]$/, "TRUST_PROXY must be a hop count from 0 to 9").default("0"),
  SECURE_COOKIES: z.enum(["auto", "0", "1"]).default("auto"),
  // The analysis pool (app/_lib/analysis-pool.ts): worker threads (default: the cores but one,
  // at most 4), jobs that may wait for one (more are answered 503), and the time limits.
  PLINTH_ANALYSIS_WORKERS: z.coerce.number().int().min(1).max(32).optional(),
  PLINTH_ANALYSIS_QUEUE: z.coerce.number().int().min(0).max(1000).default(16),
  PLINTH_ANALYSIS_TIMEOUT_MS: z.coerce.number().int().min(100).max(600_000).default(10_000),
  PLINTH_SIZING_TIMEOUT_MS: z.coerce.number().int().min(100).max(600_000).default(30_000),
  // Set by vitest in its workers: server code then runs from the TypeScript sources, not from Next's bundle.
  VITEST: z.string().optional(),
});

export type ServerEnv = z.infer<typeof envSchema>;

let cached: ServerEnv | undefined;

export function getServerEnv(): ServerEnv {
  if (!cached) {
    const parsed = envSchema.safeParse(process.env);
    if (!parsed.success) {
      const lines = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
      throw new Error(`Invalid environment:\n${lines.join("\n")}`);
    }
    cached = parsed.data;
  }
  return cached;
}

export function getSessionSecret(): string {
  const secret = getServerEnv().SESSION_SECRET;
  if (!secret) {
    throw new Error("SESSION_SECRET is not set: run `npm start` once to generate .env.local, or set it in the environment.");
  }
  return secret;
}

/** The number of trusted proxies in front of the app (TRUST_PROXY). */
export function getTrustedProxyHops(): number {
  return Number(getServerEnv().TRUST_PROXY);
}

/** Tests that change process.env call this so the next read validates it again. */
export function resetServerEnvForTests(): void {
  cached = undefined;
}

/** Under vitest (the sources run as TypeScript), not under Next. */
export function runsFromSources(): boolean {
  return getServerEnv().VITEST !== undefined;
}

export function isDemoMode(): boolean {
  return getServerEnv().PLINTH_DEMO === "1";
}
