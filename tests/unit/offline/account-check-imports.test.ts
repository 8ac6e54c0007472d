import { existsSync, readFileSync, statSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { describe, expect, it } from "vitest";

/**
 * The account check (which account's database the page uses, and switching) runs before the sync
 * runtime loads, apart from it (components/sync/sync-provider.tsx, issue #10): loading the runtime
 * late with the check inside it moved the remount into a form being typed in
 * (tests/e2e/shared-phone.spec.ts). So the provider and the check must not reach the runtime's
 * modules through a static (value) import; type-only imports are erased and do not count.
 */
const ROOT = join(__dirname, "../../..");

function resolve(from: string, spec: string): string | null {
  const base = spec.startsWith("@/") ? join(ROOT, spec.slice(2)) : spec.startsWith(".") ? join(dirname(from), spec) : null;
  if (!base) return null;
  for (const c of [base, `${base}.ts`, `${base}.tsx`]) if (existsSync(c) && statSync(c).isFile()) return c;
  return null;
}

/** Every file and package reached from `entry` by static value imports. */
function reached(entry: string): Set<string> {
  const seen = new Set<string>();
  const walk = (file: string) => {
    if (seen.has(file)) return;
    seen.add(file);
    const text = readFileSync(file, "utf8");
    for (const m of text.matchAll(/^\s*(import|export)\s+(type\s+)?[^;]*?from\s+"([^"]+)"/gms)) {
      if (m[2]) continue; // `import type … from`
      const target = resolve(file, m[3]!);
      if (target) walk(target);
      else seen.add(m[3]!);
    }
  };
  walk(join(ROOT, entry));
  return new Set([...seen].map((f) => (f.startsWith("/") ? relative(ROOT, f) : f)));
}

const RUNTIME = ["components/sync/sync-runtime.ts", "lib/offline/sync-client.ts", "lib/offline/pull.ts", "lib/offline/push.ts", "zod"];

describe("the account check comes before the sync runtime, apart from it", () => {
  it("sees the runtime's modules from the runtime itself (the walk works)", () => {
    const files = reached("components/sync/sync-runtime.ts");
    expect(RUNTIME.filter((f) => !files.has(f))).toEqual([]);
  });

  for (const entry of ["components/sync/sync-provider.tsx", "components/sync/account-check.ts"]) {
    it(`${entry} reaches none of the runtime's modules`, () => {
      expect(existsSync(join(ROOT, entry))).toBe(true);
      const files = reached(entry);
      expect(RUNTIME.filter((f) => files.has(f))).toEqual([]);
    });
  }

  it("keeps the profile check in account-check.ts, not in the runtime", () => {
    expect(readFileSync(join(ROOT, "components/sync/account-check.ts"), "utf8")).toMatch(/export async function keepProfile/);
    expect(readFileSync(join(ROOT, "components/sync/sync-runtime.ts"), "utf8")).not.toMatch(/keepProfile|giveOwnDatabase/);
  });
});
