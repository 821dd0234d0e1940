import nextCoreWebVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";

const config = [
  ...nextCoreWebVitals,
  ...nextTypescript,
  // Flat config does not read .gitignore: every build folder (.next, .next-test, .next-<name>) is skipped.
  { ignores: [".next*/**", ".data/**", "node_modules/**", "test-results/**", "tests/browser/screenshots/**", "drizzle/**", "next-env.d.ts"] },
  {
    // The numerical core stays pure (DEVELOPERS.md): no framework, no database, no environment.
    files: ["lib/tb/**", "lib/linalg/**", "lib/fit/**", "lib/datasets/**", "lib/units/**"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: ["next", "next/*", "react", "@/db/*", "@/lib/env", "@/lib/server/*", "postgres", "drizzle-orm*"] },
      ],
      "no-restricted-properties": ["error", { object: "process", property: "env", message: "lib/ core code is pure." }],
    },
  },
];

export default config;
