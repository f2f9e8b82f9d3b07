import { z } from "zod";
import { parseTrustedProxies } from "@/lib/net/client-address";

/** Settings read once from the environment, with the defaults `.env.example` documents. */
const envSchema = z.object({
  DATABASE_URL: z.string().url().default("postgres://ampwright@127.0.0.1:54329/ampwright"),
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  SMTP_URL: z.string().default("smtp://127.0.0.1:1025"),
  MAIL_FROM: z.string().default("Ampwright <no-reply@ampwright.invalid>"),
  /** Object storage for photos and PDFs: any S3-compatible store (npm start and npm test run s3rver on loopback). */
  S3_ENDPOINT: z.string().url().default("http://127.0.0.1:4569"),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("ampwright"),
  S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
  /**
   * Proxies in front of the app whose X-Forwarded-For is believed (addresses or CIDR ranges, comma separated).
   * Default none: the caller is the address of the socket.
   */
  TRUSTED_PROXIES: z
    .string()
    .default("")
    .refine((v) => {
      try {
        parseTrustedProxies(v);
        return true;
      } catch {
        return false;
      }
    }, "TRUSTED_PROXIES is a comma-separated list of addresses or CIDR ranges, such as 10.0.0.0/8,127.0.0.1"),
  /** Signs sessions; required in production (npm start generates one for local runs). */
  BETTER_AUTH_SECRET: z.preprocess(
    (v) => (v === "" ? undefined : v), // an empty line copied from .env.example means "not set"
    z.string().min(32, "BETTER_AUTH_SECRET must be at least 32 characters").optional(),
  ),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function env(): Env {
  if (!cached) {
    const parsed = envSchema.safeParse(process.env);
    if (!parsed.success) {
      const problems = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
      throw new Error(`Ampwright's environment is not valid (${problems}). Compare with .env.example.`);
    }
    if (parsed.data.NODE_ENV === "production" && !parsed.data.BETTER_AUTH_SECRET && process.env.NEXT_PHASE !== "phase-production-build") {
      throw new Error("BETTER_AUTH_SECRET is required in production (32 or more random characters). See .env.example.");
    }
    cached = parsed.data;
  }
  return cached;
}
