import { ESLint } from "eslint";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

/**
 * The import boundaries of DEVELOPERS.md are lint errors (eslint.config.mjs, ours): each sample
 * below is linted as if it sat at the given path, and must be refused (or accepted).
 */
const eslint = new ESLint({ cwd: join(__dirname, "../../..") });

async function errors(path: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: join(__dirname, "../../..", path) });
  return (result?.messages ?? []).filter((m) => m.severity === 2).map((m) => m.ruleId ?? "");
}

describe("import boundaries (DEVELOPERS.md, ours)", { timeout: 60_000 }, () => {
  it.each([
    ["lib/tasks/sample.ts", 'import { useState } from "react";\nexport const a = useState;\n'],
    ["lib/tasks/sample.ts", 'import { db } from "@/db";\nexport const a = db;\n'],
    ["lib/sync/sample.ts", 'import { getWindowcallDb } from "@/lib/offline/db";\nexport const a = getWindowcallDb;\n'],
    ["lib/field/sample.ts", 'import Dexie from "dexie";\nexport const a = Dexie;\n'],
    ["db/queries/sample.ts", 'import type { StoredRun } from "@/lib/offline/db";\nexport type A = StoredRun;\n'],
    ["components/field/sample.tsx", 'import { db } from "@/db";\nexport const a = db;\n'],
    ["app/(app)/x/_components/sample.tsx", '"use client";\nimport { getSessionUser } from "@/lib/auth/session";\nexport const a = getSessionUser;\n'],
  ])("%s: %s is refused", async (path, code) => {
    expect((await errors(path, code)).length).toBeGreaterThan(0);
  });

  it("domain code may still read browser storage nowhere but lib/offline", async () => {
    expect(await errors("lib/field/sample.ts", "export const a = () => localStorage.getItem('x');\n")).toContain("no-restricted-globals");
    expect(await errors("lib/offline/sample.ts", "export const a = () => localStorage.getItem('x');\n")).toEqual([]);
  });

  it("a server component may read the database", async () => {
    expect(await errors("app/(app)/x/page.tsx", 'import { db } from "@/db";\nexport const a = db;\n')).toEqual([]);
  });
});
