import { z } from "zod";

/** Settings read once from the environment, with the defaults `.env.example` documents. */
const envSchema = z.object({
  DATABASE_URL: z.string().url().default("postgres://ampwright@127.0.0.1:54329/ampwright"),
  APP_URL: z.string().url().default("http://127.0.0.1:3000"),
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
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
    cached = parsed.data;
  }
  return cached;
}
