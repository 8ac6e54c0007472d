import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { ClockEstimate } from "@/lib/clock";
import type { EventBody } from "@/lib/events/schema";
import { buildFold, FOLD_VERSION, lanesOfFold, resumeFold, type RunFold } from "@/lib/results/fold-state";
import { runResult, type RecordedEvent } from "@/lib/results";
import type { DerivationInput } from "@/lib/results";
import { getCatalogueTask, type TaskLetter } from "@/lib/tasks";

/**
 * Incremental derivation (lib/results/fold-state.ts) against the full one (runResult over every
 * event, in id order): for random runs of three phones (two accounts; clocks apart, unmeasured
 * clocks, page reloads, wall-clock steps, undos of undos, corrections, rulings, model choices,
 * run ends, both lanes) split into random push batches delivered in random order, with resent
 * (duplicate) events and clock estimates arriving between pushes, the state folded push by push
 * must give exactly — JSON-identical — the lanes a full derivation gives after every push. Where
 * the fold cannot resume it says so and the run is derived in full (the fallback); the state is
 * then rebuilt from all events. The state goes through JSON between pushes, as the database keeps it.
 */

const ADA = "user-ada";
const BEN = "user-ben";
const PHONES = [
  { id: "phone-ada-1", user: ADA, thetaMs: 0 },
  { id: "phone-ada-2", user: ADA, thetaMs: -4_000 },
  { id: "phone-ben", user: BEN, thetaMs: 2_500 },
] as const;
const T0 = 1_767_000_100_000;

type Kind = "window-start" | "launch" | "landing" | "target" | "end-call" | "void" | "correct" | "penalty" | "invalid" | "unsigned" | "reflight" | "model" | "run-end";
type Step = { phone: 0 | 1 | 2; kind: Kind; lane: 0 | 1; gapMs: number; pick: number; reload: boolean; jump: boolean; noOffset: boolean };

const kindArb = fc.constantFrom<Kind>(
  "window-start", "launch", "launch", "launch", "landing", "landing", "landing", "target", "end-call",
  "void", "correct", "penalty", "invalid", "unsigned", "reflight", "model", "run-end",
);
const stepArb: fc.Arbitrary<Step> = fc.record({
  phone: fc.constantFrom(0 as const, 0 as const, 0 as const, 1 as const, 2 as const),
  kind: kindArb,
  lane: fc.constantFrom(0 as const, 1 as const),
  gapMs: fc.integer({ min: 0, max: 90_000 }),
  pick: fc.nat(),
  reload: fc.constant(false), // weighted below
  jump: fc.constant(false),
  noOffset: fc.boolean(),
});
const weighted = (p: number) => fc.integer({ min: 0, max: 99 }).map((n) => n < p);
const stepsArb = fc.array(
  fc.tuple(stepArb, weighted(4), weighted(2)).map(([s, reload, jump]) => ({ ...s, reload, jump })),
  { minLength: 1, maxLength: 60 },
);

let counter = 0;
const newId = () => `00000000-0000-7000-8000-${(++counter).toString(16).padStart(12, "0")}`;

function makeEvents(steps: readonly Step[]): RecordedEvent[] {
  const state = PHONES.map((p, i) => ({ t: T0 + i * 7_000, page: 1, monoBase: 0, wallShift: 0, seq: 0, mine: [] as RecordedEvent[] }));
  const out: RecordedEvent[] = [];
  for (const s of steps) {
    const phone = PHONES[s.phone];
    const st = state[s.phone]!;
    st.t += s.gapMs;
    if (s.reload) {
      st.page += 1;
      st.monoBase = st.t - 1_000; // a new page's steady clock starts near zero
    }
    if (s.jump) st.wallShift += 45_000;
    const target = st.mine.length ? st.mine[s.pick % st.mine.length]! : null;
    const launches = st.mine.filter((e) => e.body.kind === "launch");
    let body: EventBody;
    switch (s.kind) {
      case "void":
        body = target ? { kind: "void", targetId: target.id } : { kind: "launch", lane: s.lane };
        break;
      case "correct":
        body = target ? { kind: "correct", targetId: target.id, wallMs: target.stamp.wallMs - 1_500 } : { kind: "landing", lane: s.lane };
        break;
      case "penalty":
        body = { kind: "penalty", lane: s.lane, points: 100, reason: "safety", ...(launches.length ? { launchId: launches[s.pick % launches.length]!.id } : {}) };
        break;
      case "invalid":
        body = launches.length && s.pick % 3 > 0
          ? { kind: "invalid", lane: s.lane, flightId: launches[s.pick % launches.length]!.id, reason: "part-lost" }
          : { kind: "invalid", lane: s.lane, flightIndex: s.pick % 4, reason: "part-lost" };
        break;
      case "unsigned":
        body = { kind: "unsigned", lane: s.lane };
        break;
      case "reflight":
        body = { kind: "reflight", lane: s.lane, cause: "launch-collision", placement: "later-group" };
        break;
      case "target":
        body = { kind: "target", lane: s.lane, targetSec: 30 + (s.pick % 5) * 15 };
        break;
      case "model":
        body = { kind: "model", lane: s.lane, modelId: "00000000-0000-7000-8000-00000000abcd" };
        break;
      case "window-start":
      case "run-end":
        body = { kind: s.kind };
        break;
      default:
        body = { kind: s.kind, lane: s.lane };
    }
    const offset: ClockEstimate | null = s.noOffset ? null : { thetaMs: phone.thetaMs, deltaMs: 20, measuredAtWallMs: T0 - phone.thetaMs };
    const e: RecordedEvent = {
      id: newId(), deviceId: phone.id, seq: ++st.seq, recordedBy: phone.user, body,
      stamp: { wallMs: st.t - phone.thetaMs + st.wallShift, monoMs: st.t - st.monoBase, pageId: `page-${st.page}`, offset },
    };
    st.mine.push(e);
    out.push(e);
  }
  return out;
}

/** Random batches (consecutive or scattered), delivered in a random order, some events resent. */
function batchesOf(events: readonly RecordedEvent[], sizes: readonly number[], order: readonly number[], resend: readonly number[], scatter: boolean): RecordedEvent[][] {
  const pool = scatter ? [...events].sort((a, b) => ((order[Number.parseInt(a.id.slice(-6), 16) % order.length] ?? 0) - (order[Number.parseInt(b.id.slice(-6), 16) % order.length] ?? 0))) : [...events];
  const batches: RecordedEvent[][] = [];
  for (let i = 0, k = 0; i < pool.length; k++) {
    const n = sizes[k % sizes.length]!;
    batches.push(pool.slice(i, i + n));
    i += n;
  }
  const keyed = batches.map((b, i) => ({ b, key: order[i % order.length]! * 1000 + i }));
  if (scatter) keyed.sort((a, b) => a.key - b.key);
  const out = keyed.map((k) => k.b);
  for (const [i, r] of resend.entries()) {
    const from = out[r % out.length]!;
    out.splice(Math.min(out.length, (r + i) % (out.length + 1)), 0, from.slice(0, 1 + (r % 3)));
  }
  return out;
}

type Facts = Omit<DerivationInput, "events">;

function factsFor(letter: TaskLetter, estimates: Map<string, ClockEstimate[]>): Facts {
  return {
    task: getCatalogueTask(letter),
    createdBy: ADA,
    lanes: [{ lane: 0, pilotUserId: ADA }, { lane: 1, pilotUserId: null }],
    officials: new Set(),
    estimatesByDevice: estimates,
  };
}

const byId = (a: RecordedEvent, b: RecordedEvent) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
const json = (x: unknown) => JSON.stringify(x);

/** Push by push as the server does it: resume from the stored state or derive in full and rebuild it. */
function replay(letter: TaskLetter, batches: readonly RecordedEvent[][], estimateAt: readonly number[]) {
  const estimates = new Map<string, ClockEstimate[]>(PHONES.map((p, i) => [p.id, i === 1 ? [] : [{ thetaMs: p.thetaMs, deltaMs: 30, measuredAtWallMs: T0 - 60_000 }]]));
  const stored = new Map<string, RecordedEvent>();
  let fold: RunFold | null = null;
  const tally = { resumed: 0, fallbacks: 0, noState: 0, reasons: new Set<string>() };
  batches.forEach((batch, b) => {
    if (estimateAt.includes(b)) {
      // a clock measurement arrives between pushes (POST /api/time): anchors of folded pages may move
      const phone = PHONES[b % PHONES.length]!;
      estimates.set(phone.id, [...(estimates.get(phone.id) ?? []), { thetaMs: phone.thetaMs + 150, deltaMs: 12, measuredAtWallMs: T0 + b * 40_000 }]);
    }
    const facts = factsFor(letter, new Map(estimates));
    const fresh = batch.filter((e) => !stored.has(e.id)); // a resent event is acked as a duplicate, not added
    for (const e of fresh) stored.set(e.id, e);
    const all = [...stored.values()].sort(byId);
    const full = runResult({ ...facts, events: all }).lanes;
    let lanes;
    const before = fold && json(fold);
    const resumed = fold ? resumeFold(fold, facts, fresh, all.length) : null;
    if (fold) {
      expect(json(fold)).toBe(before); // not owned: the stored state is left as it was
      // owned (as the server resumes a state it just read): folded in place, the same outcome as on a copy
      expect(json(resumeFold(JSON.parse(before!) as RunFold, facts, fresh, all.length, true))).toBe(json(resumed));
    }
    if (resumed?.ok) {
      tally.resumed++;
      lanes = resumed.lanes;
      fold = JSON.parse(json(resumed.fold)) as RunFold;
    } else {
      if (resumed) {
        tally.fallbacks++;
        tally.reasons.add(resumed.reason);
      }
      lanes = full;
      fold = buildFold({ ...facts, events: all });
      if (fold) {
        fold = JSON.parse(json(fold)) as RunFold;
        expect(json(lanesOfFold(fold, facts))).toBe(json(full)); // the state, just built, gives the full result
      } else tally.noState++;
    }
    expect(json(lanes)).toBe(json(full));
  });
  return tally;
}

describe("incremental derivation equals full derivation (property)", () => {
  const total = { resumed: 0, fallbacks: 0, noState: 0, reasons: new Set<string>() };

  it("over random runs, random batches in random order, duplicates and late clock estimates", () => {
    fc.assert(
      fc.property(
        stepsArb,
        fc.array(fc.integer({ min: 1, max: 9 }), { minLength: 1, maxLength: 20 }),
        fc.array(fc.nat({ max: 50 }), { minLength: 1, maxLength: 20 }),
        fc.array(fc.nat({ max: 40 }), { maxLength: 4 }),
        fc.array(fc.nat({ max: 30 }), { maxLength: 3 }),
        fc.boolean(),
        fc.constantFrom<TaskLetter>("H", "B", "J", "F", "A", "E", "C", "G"),
        (steps, sizes, order, resend, estimateAt, scatter, letter) => {
          const t = replay(letter, batchesOf(makeEvents(steps), sizes, order, resend, scatter), estimateAt);
          total.resumed += t.resumed;
          total.fallbacks += t.fallbacks;
          total.noState += t.noState;
          for (const r of t.reasons) total.reasons.add(r);
        },
      ),
      { numRuns: Number(process.env.FOLD_PROPERTY_RUNS ?? 400), seed: Number(process.env.FOLD_PROPERTY_SEED ?? 20261204) },
    );
    // both paths were taken, or the property says little
    expect(total.resumed).toBeGreaterThan(100);
    expect(total.fallbacks).toBeGreaterThan(20);
  }, 120_000);

  it("an append-only run timed on one phone folds every push without a full derivation", () => {
    const steps: Step[] = [{ phone: 0, kind: "window-start", lane: 0, gapMs: 0, pick: 0, reload: false, jump: false, noOffset: false }];
    for (let i = 0; i < 120; i++) steps.push({ phone: 0, kind: i % 2 ? "landing" : "launch", lane: (i >> 1) % 2 === 0 ? 0 : 1, gapMs: 20_000 + i * 97, pick: i, reload: i === 61, jump: false, noOffset: false });
    steps.push({ phone: 0, kind: "run-end", lane: 0, gapMs: 5_000, pick: 0, reload: false, jump: false, noOffset: false });
    const events = makeEvents(steps);
    const batches: RecordedEvent[][] = [];
    for (let i = 0; i < events.length; i += 7) batches.push(events.slice(i, i + 7));
    const t = replay("H", batches, []);
    // the first push of each lane starts its record (a new candidate): the rest resume
    expect(t.fallbacks).toBeLessThanOrEqual(1);
    expect(t.resumed).toBeGreaterThanOrEqual(batches.length - 2);
  });

  it("keeps a cross-device record's landing uncertainty: a landing timed on a never-measured clock stays for review when it is folded in", () => {
    const step = (phone: 0 | 1, kind: Kind, gapMs: number): Step => ({ phone, kind, lane: 0, gapMs, pick: 0, reload: false, jump: false, noOffset: phone === 1 });
    const events = makeEvents([step(0, "window-start", 0), step(1, "launch", 20_000), step(1, "landing", 40_000)]);
    const estimates = new Map<string, ClockEstimate[]>([[PHONES[0].id, [{ thetaMs: 0, deltaMs: 30, measuredAtWallMs: T0 }]]]);
    const facts = factsFor("H", estimates);
    const landing = events.find((e) => e.body.kind === "landing")!;
    const first = events.filter((e) => e !== landing);
    const fold = JSON.parse(json(buildFold({ ...facts, events: first }))) as RunFold;
    const resumed = resumeFold(fold, facts, [landing], events.length);
    const full = runResult({ ...facts, events: [...events].sort(byId) }).lanes;
    // the case is there: the landing's unknown clock leaves the end of the landing window uncertain
    expect(full[0]!.derived.review.map((r) => r.boundary)).toContain("end of the landing window");
    expect(resumed.ok).toBe(true);
    expect(resumed.ok && json(resumed.lanes)).toBe(json(full));
  });

  it("falls back, and says why, for an out-of-order arrival, an undo, a late estimate and another fold version", () => {
    const steps: Step[] = [{ phone: 0, kind: "window-start", lane: 0, gapMs: 0, pick: 0, reload: false, jump: false, noOffset: false }];
    for (let i = 0; i < 8; i++) steps.push({ phone: 0, kind: i % 2 ? "landing" : "launch", lane: 0, gapMs: 30_000, pick: 0, reload: false, jump: false, noOffset: false });
    const events = makeEvents(steps);
    const estimates = new Map<string, ClockEstimate[]>([[PHONES[0].id, [{ thetaMs: 0, deltaMs: 30, measuredAtWallMs: T0 }]]]);
    const facts = factsFor("H", estimates);
    const first = [...events.slice(0, 5), ...events.slice(7)];
    const fold = buildFold({ ...facts, events: first })!;
    expect(fold).not.toBeNull();
    const late = events.slice(5, 7); // a launch and landing sent late: earlier than what was folded
    expect(resumeFold(fold, facts, late, events.length)).toEqual({ ok: false, reason: "an event earlier than its page's last folded one" });
    const undo: RecordedEvent = { ...events[8]!, id: newId(), seq: 99, stamp: { ...events[8]!.stamp, monoMs: events[8]!.stamp.monoMs + 1, wallMs: events[8]!.stamp.wallMs + 1 }, body: { kind: "void", targetId: events[8]!.id } };
    expect(resumeFold(fold, facts, [undo], first.length + 1)).toEqual({ ok: false, reason: "a new void" });
    const moved = factsFor("H", new Map([[PHONES[0].id, [{ thetaMs: 900, deltaMs: 10, measuredAtWallMs: T0 }]]]));
    expect(resumeFold(fold, moved, [], first.length)).toEqual({ ok: false, reason: "clock estimates moved a folded page" });
    expect(resumeFold({ ...fold, v: FOLD_VERSION + 1 }, facts, [], first.length)).toEqual({ ok: false, reason: "the fold's code changed" });
    expect(resumeFold(fold, facts, [], first.length + 3)).toEqual({ ok: false, reason: "events were stored or removed outside the fold" });
    // and nothing is left behind by a refused resume: the same state still resumes with nothing new
    const same = resumeFold(fold, facts, [], first.length);
    expect(same.ok && json(same.lanes)).toBe(json(runResult({ ...facts, events: first.sort(byId) }).lanes));
  });
});
