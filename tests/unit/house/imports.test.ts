import { readdirSync, readFileSync, statSync, existsSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { describe, expect, it } from "vitest";

/**
 * The house rules of DEVELOPERS.md on imports, read from the source files themselves (ours):
 * no import circles between files, and the server never imports the phone's folder.
 */
const ROOT = join(__dirname, "../../..");
const FOLDERS = ["lib", "components", "app", "db"];

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...sourceFiles(p));
    else if (/\.(ts|tsx)$/.test(name) && !name.endsWith(".d.ts")) out.push(p);
  }
  return out;
}

function resolve(from: string, spec: string): string | null {
  let base: string;
  if (spec.startsWith("@/")) base = join(ROOT, spec.slice(2));
  else if (spec.startsWith(".")) base = join(dirname(from), spec);
  else return null;
  for (const c of [base, `${base}.ts`, `${base}.tsx`, join(base, "index.ts"), join(base, "index.tsx")]) {
    if (existsSync(c) && statSync(c).isFile()) return c;
  }
  return null;
}

const files = FOLDERS.flatMap((f) => sourceFiles(join(ROOT, f)));
const edges = new Map<string, string[]>();
for (const f of files) {
  const text = readFileSync(f, "utf8");
  const specs = [...text.matchAll(/^\s*(?:import|export)\s[^;]*?from\s+"([^"]+)"/gms)].map((m) => m[1]!);
  edges.set(f, specs.map((s) => resolve(f, s)).filter((x): x is string => x !== null));
}

/** Strongly connected components with more than one file (Tarjan). */
function circles(): string[][] {
  let index = 0;
  const idx = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const on = new Set<string>();
  const out: string[][] = [];
  const visit = (v: string) => {
    idx.set(v, index);
    low.set(v, index++);
    stack.push(v);
    on.add(v);
    for (const w of edges.get(v) ?? []) {
      if (!idx.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (on.has(w)) low.set(v, Math.min(low.get(v)!, idx.get(w)!));
    }
    if (low.get(v) === idx.get(v)) {
      const comp: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        on.delete(w);
        comp.push(relative(ROOT, w));
      } while (w !== v);
      if (comp.length > 1) out.push(comp.sort());
    }
  };
  for (const f of files) if (!idx.has(f)) visit(f);
  return out;
}

/** Folder-level circles among lib's top folders (lib/offline ↔ lib/field was one). */
function folderCircles(): string[][] {
  const top = (f: string) => relative(ROOT, f).split("/").slice(0, 2).join("/");
  const folderEdges = new Map<string, Set<string>>();
  for (const [f, targets] of edges) {
    if (!relative(ROOT, f).startsWith("lib/")) continue;
    for (const t of targets) {
      if (!relative(ROOT, t).startsWith("lib/") || top(t) === top(f)) continue;
      const set = folderEdges.get(top(f)) ?? new Set();
      set.add(top(t));
      folderEdges.set(top(f), set);
    }
  }
  const out: string[][] = [];
  for (const [a, targets] of folderEdges) for (const b of targets) if (a < b && folderEdges.get(b)?.has(a)) out.push([a, b]);
  return out;
}

describe("imports (DEVELOPERS.md house rules, ours)", () => {
  it("no two files import each other, directly or through others", () => {
    expect(circles()).toEqual([]);
  });

  it("no two lib/ folders import each other", () => {
    expect(folderCircles()).toEqual([]);
  });

  it("server code (db/, app/api/, lib/sync, lib/validations) imports nothing from the phone's lib/offline", () => {
    const server = files.filter((f) => /^(db|app\/api|lib\/sync|lib\/validations)\//.test(relative(ROOT, f)));
    const offending = server.filter((f) => (edges.get(f) ?? []).some((t) => relative(ROOT, t).startsWith("lib/offline/")));
    expect(offending.map((f) => relative(ROOT, f))).toEqual([]);
  });
});
