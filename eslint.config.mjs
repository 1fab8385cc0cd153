import nextVitals from "eslint-config-next/core-web-vitals";
import nextTypeScript from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTypeScript,
  {
    ignores: [".next/**", ".next-test/**", ".data/**", "node_modules/**", "test-results/**", "bench/out/**", "dist/**", "next-env.d.ts"],
  },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    // geometry/ is pure numerical code shared by server, browser, CLI and tests.
    files: ["geometry/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["react", "react-dom", "next", "next/*", "sequelize", "pg", "three", "@react-three/*", "node:*", "fs", "path"],
              message: "geometry/ stays pure: no framework, database or Node imports.",
            },
            { group: ["@/lib/*", "@/components/*", "@/app/*", "@/models/*"], message: "geometry/ must not depend on the app." },
          ],
        },
      ],
    },
  },
];

export default config;
