import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  { ignores: [".next/**", ".next-*/**", "node_modules/**", ".local/**", "drizzle/**", "test-artifacts/**", "next-env.d.ts"] },
  {
    // The domain modules stay pure: no framework, UI or database imports.
    files: ["modules/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["next", "next/*"], message: "modules/ is pure TypeScript: no next imports." },
            { group: ["react", "react-dom", "react/*"], message: "modules/ is pure TypeScript: no react imports." },
            { group: ["@/db", "@/db/*", "**/db/*", "pg", "drizzle-orm", "drizzle-orm/*"], message: "modules/ must not talk to the database." },
          ],
        },
      ],
    },
  },
];

export default config;
