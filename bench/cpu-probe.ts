/**
 * Where a page's main-thread time goes while it loads: `PROBE_URL=… [PROBE_COOKIE=…] npx tsx bench/cpu-probe.ts`.
 * Fresh context of Debian's Chromium, 4× CPU throttling, a CPU profile over the load and PROBE_MS after it
 * (default 6000), and long tasks (PerformanceObserver). Prints the long tasks and the top functions by
 * inclusive and self time, named by script (chunk) and function. PROBE_SKIP (a regular expression) leaves matching
 * frames out of each task's list, e.g. `chunks/(4bd1b696|5254)-` for React's and Next's own.
 */
import { openProbePage } from "./probe-page";

type Node = { id: number; callFrame: { functionName: string; url: string; lineNumber: number; columnNumber: number }; children?: number[] };
const { url, browser, page, cdp } = await openProbePage();
try {
  await page.evaluateOnNewDocument(() => {
    (window as unknown as { __lt: unknown[] }).__lt = [];
    new PerformanceObserver((l) => {
      for (const e of l.getEntries()) (window as unknown as { __lt: unknown[] }).__lt.push([Math.round(e.startTime), Math.round(e.duration)]);
    }).observe({ type: "longtask", buffered: true });
  });
  await cdp.send("Profiler.enable");
  await cdp.send("Profiler.setSamplingInterval", { interval: 200 });
  await cdp.send("Profiler.start");
  await page.goto(url, { waitUntil: "load" });
  await new Promise((r) => setTimeout(r, Number(process.env.PROBE_MS ?? 6000)));
  const { profile } = (await cdp.send("Profiler.stop")) as unknown as { profile: { nodes: Node[]; samples: number[]; timeDeltas: number[] } };
  const lt = await page.evaluate(() => (window as unknown as { __lt: unknown[] }).__lt);
  console.log("long tasks [start, ms]:", JSON.stringify(lt), "total blocking:", (lt as [number, number][]).reduce((s, [, d]) => s + Math.max(0, d - 50), 0));
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const self = new Map<number, number>();
  profile.samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0) / 1000));
  const name = (n: Node) => `${n.callFrame.functionName || "(anon)"} ${n.callFrame.url.replace(/^.*\/_next\/static\//, "").replace(/^https?:\/\/[^/]+/, "")}:${n.callFrame.lineNumber}:${n.callFrame.columnNumber}`;
  const incl = new Map<string, number>();
  const selfBy = new Map<string, number>();
  for (const [id, ms] of self) {
    const seen = new Set<string>();
    const n0 = byId.get(id)!;
    selfBy.set(name(n0), (selfBy.get(name(n0)) ?? 0) + ms);
    for (let cur: number | undefined = id; cur !== undefined; cur = parent.get(cur)) {
      const k = name(byId.get(cur)!);
      if (seen.has(k)) continue;
      seen.add(k);
      incl.set(k, (incl.get(k) ?? 0) + ms);
    }
  }
  // the profile's own tasks: runs of samples between idle ones; for each over 50 ms, its heaviest frames
  const tasks: { start: number; ms: number; frames: Map<string, number> }[] = [];
  let cur: (typeof tasks)[number] | null = null;
  let clock = 0;
  profile.samples.forEach((id, i) => {
    const ms = (profile.timeDeltas[i] ?? 0) / 1000;
    clock += ms;
    const n0 = byId.get(id)!;
    if (n0.callFrame.functionName === "(idle)") {
      if (cur && cur.ms > 50) tasks.push(cur);
      cur = null;
      return;
    }
    cur ??= { start: clock, ms: 0, frames: new Map() };
    cur.ms += ms;
    const seen = new Set<string>();
    for (let c: number | undefined = id; c !== undefined; c = parent.get(c)) {
      const k = name(byId.get(c)!);
      if (seen.has(k) || /^\((root|program)\)/.test(k)) continue;
      seen.add(k);
      cur.frames.set(k, (cur.frames.get(k) ?? 0) + ms);
    }
  });
  if (cur && (cur as { ms: number }).ms > 50) tasks.push(cur);
  console.log("--- tasks over 50 ms (profile) ---");
  // PROBE_SKIP: frames left out of each task's list (e.g. React's and Next's chunks, to see the app's own frames under them)
  const skip = process.env.PROBE_SKIP ? new RegExp(process.env.PROBE_SKIP) : null;
  for (const t of tasks) {
    const heavy = [...t.frames].sort((a, b) => b[1] - a[1]).filter(([k]) => !/^(d|n|d\.O|s|a|r|t|e|\(anon\)) chunks\/(webpack|main-app)/.test(k) && !(skip && skip.test(k))).slice(0, Number(process.env.PROBE_FRAMES ?? 8));
    console.log(`${Math.round(t.start)} ms +${Math.round(t.ms)} ms: ${heavy.map(([k, v]) => `${k} ${Math.round(v)}`).join(" | ")}`);
  }
  const top = (m: Map<string, number>, n: number) => [...m].sort((a, b) => b[1] - a[1]).slice(0, n).map(([k, v]) => `${v.toFixed(0).padStart(6)} ms  ${k}`).join("\n");
  console.log("--- inclusive ---\n" + top(incl, Number(process.env.PROBE_TOP ?? 60)));
  console.log("--- self ---\n" + top(selfBy, 30));
} finally {
  await browser.close();
}
