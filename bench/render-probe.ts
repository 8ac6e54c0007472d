/**
 * What React renders and what IndexedDB does while a page loads: `PROBE_URL=… [PROBE_COOKIE=…] npx tsx bench/render-probe.ts`.
 * Same page as bench/cpu-probe.ts (fresh context, 4× CPU). A stand-in React DevTools hook counts each commit and,
 * per function component that did work in it (mounted, or React's PerformedWork flag), one render — named by its
 * (minified) name and the start of the first element it draws, since a production build has no component names.
 * `IDBDatabase.transaction` is wrapped to count read-only transactions (live queries re-reading) and writes, per
 * store list. Prints commits, renders per component and transactions, over the load and PROBE_MS after it (6000).
 */
import { openProbePage } from "./probe-page";

type Report = { commits: [number, number][]; renders: Record<string, number>; txns: Record<string, number>; txnTimes: [number, string][] };

// plain JavaScript in a string: tsx's transform would add helpers the page does not have
const INSTALL = String.raw`(() => {
  const r = { commits: [], renders: {}, txns: {}, txnTimes: [] };
  window.__probe = r;
  const hint = (f) => {
    for (let c = f.child, depth = 0; c && depth < 40; c = c.child, depth++) {
      if (c.tag === 5 && c.stateNode instanceof Element) {
        const el = c.stateNode;
        const text = (el.textContent || "").trim().slice(0, 40);
        const by = el.getAttribute("aria-labelledby");
        return "<" + el.tagName.toLowerCase() + (el.id ? "#" + el.id : "") + (by ? " [" + by + "]" : "") + "> " + text;
      }
      if (c.tag === 6) return '"' + String((c.stateNode && c.stateNode.data) || "").slice(0, 40) + '"';
    }
    return "(draws nothing)";
  };
  const named = (f) => {
    const t = f.type || {};
    return t.displayName || t.name || (t.render && t.render.name) || (t.type && t.type.name) || "?";
  };
  const isComponent = (f) => f.tag === 0 || f.tag === 1 || f.tag === 11 || f.tag === 14 || f.tag === 15;
  let rendered = 0;
  const count = (f) => {
    const k = named(f) + " " + hint(f);
    r.renders[k] = (r.renders[k] || 0) + 1;
    rendered++;
  };
  const mountAll = (f) => {
    for (let c = f; c; c = c.sibling) {
      if (isComponent(c)) count(c);
      mountAll(c.child);
    }
  };
  // DevTools' walk: a subtree whose child list did not change was not rendered in this commit
  const walk = (next, prev) => {
    if (!prev) {
      if (isComponent(next)) count(next);
      mountAll(next.child);
      return;
    }
    if (isComponent(next) && (next.flags & 1) === 1) count(next);
    if (next.child === prev.child) return;
    for (let c = next.child; c; c = c.sibling) walk(c, c.alternate);
  };
  window.__REACT_DEVTOOLS_GLOBAL_HOOK__ = {
    supportsFiber: true, isDisabled: false, renderers: new Map(),
    inject() { return 1; }, checkDCE() {}, onScheduleFiberRoot() {}, onCommitFiberUnmount() {}, onPostCommitFiberRoot() {},
    onCommitFiberRoot(_id, root) {
      rendered = 0;
      walk(root.current, root.current.alternate);
      r.commits.push([Math.round(performance.now()), rendered]);
    },
  };
  const tx = IDBDatabase.prototype.transaction;
  IDBDatabase.prototype.transaction = function (stores, mode, ...rest) {
    const k = (mode || "readonly") + " " + [stores].flat().join(",");
    r.txns[k] = (r.txns[k] || 0) + 1;
    r.txnTimes.push([Math.round(performance.now()), k]);
    return tx.call(this, stores, mode, ...rest);
  };
})()`;

const { url, browser, page } = await openProbePage();
try {
  await page.evaluateOnNewDocument(INSTALL);
  await page.goto(url, { waitUntil: "load" });
  await new Promise((r) => setTimeout(r, Number(process.env.PROBE_MS ?? 6000)));
  const r = (await page.evaluate("window.__probe")) as Report;
  console.log(`commits: ${r.commits.length}; [ms, components rendered]: ${JSON.stringify(r.commits)}`);
  const sorted = (m: Record<string, number>) => Object.entries(m).sort((a, b) => b[1] - a[1]);
  console.log(`--- renders per component (${Object.values(r.renders).reduce((s, n) => s + n, 0)} in all) ---`);
  for (const [k, n] of sorted(r.renders).slice(0, Number(process.env.PROBE_TOP ?? 60))) console.log(`${String(n).padStart(5)}  ${k}`);
  const ro = Object.entries(r.txns).filter(([k]) => k.startsWith("readonly")).reduce((s, [, n]) => s + n, 0);
  console.log(`--- IndexedDB transactions (${ro} read-only, ${r.txnTimes.length - ro} read-write) ---`);
  for (const [k, n] of sorted(r.txns)) console.log(`${String(n).padStart(5)}  ${k}`);
  if (process.env.PROBE_TXN_TIMES) console.log(r.txnTimes.map(([t, k]) => `${t} ${k}`).join("\n"));
} finally {
  await browser.close();
}
