import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import nextPlugin from "@next/eslint-plugin-next";

export default tseslint.config(
  {
    ignores: [
      "node_modules/**",
      ".next/**",
      ".next-test/**",
      ".next-bench/**",
      ".next-*/**",
      ".data/**",
      "drizzle/**",
      "test-results/**",
      "playwright-report/**",
      "next-env.d.ts",
      "tests/integration/generated/**",
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommendedTypeChecked.map((c) => ({ ...c, files: ["**/*.{ts,tsx}"] })),
  {
    files: ["**/*.{ts,tsx}"],
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    plugins: { "react-hooks": reactHooks, "@next/next": nextPlugin },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...nextPlugin.configs.recommended.rules,
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-misused-promises": ["error", { checksVoidReturn: { attributes: false } }],
      "@typescript-eslint/only-throw-error": "off",
      "@typescript-eslint/require-await": "off",
    },
  },
  {
    files: ["**/*.mjs"],
    rules: { "no-unused-vars": ["error", { argsIgnorePattern: "^_" }] },
    languageOptions: { globals: { process: "readonly", console: "readonly", URL: "readonly", setTimeout: "readonly", clearTimeout: "readonly", Buffer: "readonly" } },
  },
  {
    // Tests read JSON from processes and responses; asserting on it is the point.
    files: ["tests/**/*.ts", "bench/**/*.ts"],
    rules: {
      "@typescript-eslint/no-unsafe-assignment": "off",
      "@typescript-eslint/no-unsafe-member-access": "off",
      "@typescript-eslint/no-unsafe-argument": "off",
      "@typescript-eslint/no-unsafe-call": "off",
    },
  },
  {
    // lib/ is pure domain logic shared by browser and server; components never reach the database.
    files: ["lib/**/*.ts", "components/**/*.{ts,tsx}"],
    ignores: ["lib/platform/**", "lib/use-cases/**"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [{ group: ["@/db", "@/db/*", "pg", "drizzle-orm", "drizzle-orm/*"], message: "Only db/, lib/platform and lib/use-cases reach PostgreSQL." }] }],
    },
  },
  {
    // Screens talk to the API through the typed client only, and its errors are already AppError.
    files: ["components/**/*.{ts,tsx}", "app/**/*.tsx"],
    rules: {
      "no-restricted-globals": ["error", { name: "fetch", message: "Call the API with apiCall/apiQuery from @/lib/api/client." }],
      "no-restricted-syntax": ["error", { selector: "TSAsExpression > TSTypeReference[typeName.name='AppError']", message: "Query and mutation errors are typed AppError already; do not cast." }],
    },
  },
);
