import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: ["node_modules/**", ".next/**", ".next-test/**", ".next-bench/**", ".data/**", "test-artifacts/**", "drizzle/**", "next-env.d.ts"],
  },
  {
    rules: {
      "no-console": ["error", { allow: ["warn", "error", "info"] }],
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    files: ["scripts/**", "db/migrate.ts", "db/seed.ts", "tests/**"],
    rules: { "no-console": "off" },
  },
];

export default config;
