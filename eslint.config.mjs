// Lint exists here mainly to hold one architectural line: the mathematics in lib/core (and the pure
// domain modules beside it) never imports the framework or the database, so the server, the worker
// pool and the offline checker share one implementation.
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import nextPlugin from "@next/eslint-plugin-next";

const frameworkAndDatabase = {
  patterns: [
    { group: ["next", "next/*", "next-auth", "next-auth/*"], message: "lib/core is framework-free: no Next.js or next-auth here." },
    { group: ["react", "react-dom", "react/*", "react-dom/*"], message: "lib/core is framework-free: no React here." },
    {
      group: ["sequelize", "mariadb", "umzug", "@/models", "@/models/*", "@/lib/db", "@/lib/data/*", "**/models/**"],
      message: "lib/core never touches the database.",
    },
    { group: ["server-only"], message: "lib/core also runs in the offline checker and in workers." },
  ],
};

export default tseslint.config(
  { ignores: ["node_modules/**", ".next/**", ".next-*/**", ".data/**", "test-results/**", "next-env.d.ts", "public/**", "bin/*.bundle.mjs"] },
  {
    files: ["**/*.{ts,tsx,mjs}"],
    languageOptions: { parser: tseslint.parser },
    plugins: { "@typescript-eslint": tseslint.plugin },
    rules: { "no-debugger": "error", "no-var": "error", "prefer-const": "error" },
  },
  {
    // The rules of hooks and the framework's own rules (links, images, scripts, fonts).
    files: ["app/**/*.{ts,tsx}", "components/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks, "@next/next": nextPlugin },
    rules: {
      "react-hooks/rules-of-hooks": "error",
      "react-hooks/exhaustive-deps": "error",
      ...nextPlugin.configs.recommended.rules,
      ...nextPlugin.configs["core-web-vitals"].rules,
    },
  },
  {
    files: ["lib/core/**/*.ts", "lib/proof-tree.ts", "lib/review/**/*.ts", "lib/verification/layout*.ts", "lib/verification/picture.ts"],
    rules: { "no-restricted-imports": ["error", frameworkAndDatabase] },
  },
);
