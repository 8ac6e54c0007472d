import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

/*
 * The boundaries of DEVELOPERS.md "Where things live", enforced:
 * - domain code in lib/ imports no framework, no database and no browser storage (lib/auth and
 *   lib/query are the framework glue, lib/offline is the browser's storage);
 * - the server (db/, app/api/, lib/sync/, lib/validations/) never imports the phone's folder;
 * - client code (components/, and any "use client" file) imports no database or server-only code.
 */
const FRAMEWORK = ["next", "next/*", "next-auth", "next-auth/*", "react", "react-dom", "react/*", "react-dom/*", "@tanstack/*", "server-only"];
const DATABASE = ["@/db", "@/db/*", "drizzle-orm", "drizzle-orm/*", "pg"];
const BROWSER_STORAGE = ["dexie", "dexie-react-hooks", "@/lib/offline/*"];
const SERVER_ONLY = [...DATABASE, "server-only", "@/lib/auth/*", "!@/lib/auth/next-auth", "@/lib/api-auth-guard"];

const patterns = (group, message) => ({ group, message });

/** "use client" files: report imports of database or server-only modules. */
const clientBoundary = {
  meta: { type: "problem", schema: [] },
  create(context) {
    const body = context.sourceCode.ast.body;
    const isClient = body.some((n) => n.type === "ExpressionStatement" && n.directive === "use client");
    if (!isClient) return {};
    const banned = (src) => src === "@/db" || src.startsWith("@/db/") || src === "server-only" || src === "pg" || src.startsWith("drizzle-orm") || src.startsWith("@/lib/auth/");
    return {
      ImportDeclaration(node) {
        if (banned(node.source.value)) context.report({ node, message: `A client component imports no database or server-only code (${node.source.value}).` });
      },
    };
  },
};

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  {
    files: ["lib/**/*.ts"],
    // lib/mail/server/ sends mail (SMTP connection, queue drain, timer): server I/O guarded by server-only, like lib/auth.
    // lib/storage/server/ talks to object storage (S3 client, presigned URLs): server I/O guarded by server-only too.
    // lib/payments/server/ talks to the payments service (the stripe SDK, webhook signatures): server I/O guarded by server-only too.
    ignores: ["lib/auth/**", "lib/query/**", "lib/offline/**", "lib/mail/server/**", "lib/storage/server/**", "lib/payments/server/**"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            patterns(FRAMEWORK, "Domain code in lib/ imports no framework (DEVELOPERS.md)."),
            patterns(DATABASE, "Domain code in lib/ imports no database code: that lives in db/ (DEVELOPERS.md)."),
            patterns(BROWSER_STORAGE, "Domain code in lib/ imports no browser storage: that lives in lib/offline (DEVELOPERS.md)."),
          ],
        },
      ],
      "no-restricted-globals": [
        "error",
        { name: "localStorage", message: "Domain code in lib/ reads no browser storage." },
        { name: "sessionStorage", message: "Domain code in lib/ reads no browser storage." },
        { name: "indexedDB", message: "Domain code in lib/ reads no browser storage." },
      ],
    },
  },
  {
    files: ["lib/offline/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [patterns(SERVER_ONLY, "The phone's storage and sync client import no server code.")] }],
    },
  },
  {
    files: ["db/**/*.ts", "app/api/**/*.ts", "lib/sync/**/*.ts", "lib/validations/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [patterns(BROWSER_STORAGE, "Server code imports nothing from the phone's folder: shared shapes live in lib/events.")] },
      ],
    },
  },
  {
    files: ["components/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": ["error", { patterns: [patterns(SERVER_ONLY, "Shared UI runs in the browser: no database or server-only code.")] }],
    },
  },
  {
    files: ["**/*.{ts,tsx}"],
    plugins: { windowcall: { rules: { "client-boundary": clientBoundary } } },
    rules: { "windowcall/client-boundary": "error" },
  },
  globalIgnores([".next/**", "public/sw.js", "public/swe-worker-*.js", "node_modules/**", "db/migrations/**", "test-results/**", "playwright-report/**", "next-env.d.ts"]),
]);
