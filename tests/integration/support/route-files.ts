import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";

const ROOT = path.resolve(__dirname, "../../..");
const METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export type Method = (typeof METHODS)[number];
export type Handler = (request: Request, context?: unknown) => Promise<Response>;
export type RouteHandler = { key: string; method: Method; path: string; file: string; handler: Handler };

function walk(dir: string, match: (file: string) => boolean, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) walk(full, match, out);
    else if (match(full)) out.push(full);
  }
  return out;
}

/**
 * Every route handler in the app, found on disk: each app/api/**\/route.ts and each HTTP method it
 * exports, keyed "METHOD /api/path" (dynamic segments as written, e.g. /api/runs/[id]).
 */
export async function discoverRouteHandlers(): Promise<RouteHandler[]> {
  const files = walk(path.join(ROOT, "app/api"), (f) => /[\\/]route\.(ts|tsx|js)$/.test(f)).sort();
  const out: RouteHandler[] = [];
  for (const file of files) {
    const rel = path.relative(path.join(ROOT, "app"), path.dirname(file)).split(path.sep).join("/");
    const urlPath = "/" + rel.split("/").filter((s) => !/^\(.*\)$/.test(s)).join("/");
    const mod = (await import(file)) as Record<string, unknown>;
    for (const method of METHODS) {
      const handler = mod[method];
      if (typeof handler === "function") out.push({ key: `${method} ${urlPath}`, method, path: urlPath, file, handler: handler as Handler });
    }
  }
  return out;
}

/** Files under app/, components/ and lib/ that declare server actions ("use server" at the top of the file or a function). */
export function discoverServerActionFiles(): string[] {
  const dirs = ["app", "components", "lib"].map((d) => path.join(ROOT, d));
  return dirs
    .flatMap((d) => walk(d, (f) => /\.(ts|tsx)$/.test(f)))
    .filter((f) => /^\s*["']use server["'];?\s*$/m.test(readFileSync(f, "utf8")))
    .map((f) => path.relative(ROOT, f).split(path.sep).join("/"))
    .sort();
}

/**
 * Route files that are club-scoped: a path segment names a club (`/clubs/`, `[clubId]`, `[club]`)
 * or the handler's source reads a `clubId` (from its body, query or params). Paths relative to the root.
 */
export function clubScopedRouteFiles(): { file: string; source: string }[] {
  return walk(path.join(ROOT, "app/api"), (f) => /[\\/]route\.(ts|tsx|js)$/.test(f))
    .map((f) => ({ file: path.relative(ROOT, f).split(path.sep).join("/"), source: readFileSync(f, "utf8") }))
    .filter(({ file, source }) => /\/clubs?\/|\[club(Id|Slug)?\]/.test(file) || /\bclub_?[iI]d\b/.test(source))
    .sort((a, b) => a.file.localeCompare(b.file));
}
