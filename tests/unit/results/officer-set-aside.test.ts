import { describe, expect, it } from "vitest";
import { officerDeviceId, runEventSchema, type EventBody } from "@/lib/events/schema";
import { runResult, setAsidePenalties } from "@/lib/results";
import { eventRefusal } from "@/lib/sync/authorise";
import { correctStamp, uncertaintyOf } from "@/lib/sync/correct-events";
import type { DerivationEvent } from "@/lib/sync/types";
import { getCatalogueTask } from "@/lib/tasks";
import { device, estimatesOf, nextId } from "../sync/helpers";

/**
 * An officer sets a timekeeper's penalty aside (db/queries/contest-phone-set-aside.ts): a server-authored
 * `void` with `setAside`, on a device of its own, which the one path (lib/results runResult) folds as an
 * undo of that penalty, so every number is derived again from the events.
 */
const H = getCatalogueTask("H");
const KEEPER = "timekeeper-user";
const OFFICER = "officer-user";
/** A contest run: KEEPER its assigned timekeeper, one named pilot without an account on the phone (as a duty sets it up). */
const contestRun = { createdBy: KEEPER, officials: new Set([KEEPER]), lanes: [{ lane: 0, pilotUserId: null }] };

/** The event the server writes for an officer's set-aside, stamped with the server's clock (θ = 0). */
function setAside(penalty: DerivationEvent, atMs: number, reason: string): DerivationEvent {
  const stamp = { wallMs: atMs, monoMs: 0, pageId: "officer", offset: { thetaMs: 0, deltaMs: 0, measuredAtWallMs: atMs } };
  const c = correctStamp(stamp, []);
  return {
    id: nextId(), deviceId: officerDeviceId(penalty.id), seq: 1, recordedBy: OFFICER, stamp,
    body: { kind: "void", targetId: penalty.id, setAside: { reason } }, correctedMs: c.correctedMs, uncertaintyMs: uncertaintyOf(c.uncertaintyMs),
  };
}

function timed() {
  const phone = device("keeper-phone", KEEPER);
  phone.at(0, { kind: "window-start" });
  const launch = phone.at(1000, { kind: "launch", lane: 0 });
  phone.at(91_000, { kind: "landing", lane: 0 }); // 90 s
  phone.flights(0, [120], 100_000); // a second attempt, 120 s
  return { phone, launch };
}

const derive = (events: DerivationEvent[], phone: ReturnType<typeof device>) =>
  runResult({ ...contestRun, task: H, events, estimatesByDevice: estimatesOf(phone) }).lanes[0]!;

describe("an officer's set-aside of a phone's penalty re-derives the lane", () => {
  it("F3K.4.3 (RULES.md \"Penalties\": several in one attempt → only the highest): setting the highest aside promotes the next", () => {
    const { phone, launch } = timed();
    const p300 = phone.at(95_000, { kind: "penalty", lane: 0, points: 300, reason: "Touched a person in the safety area", cause: "person-in-safety-area", launchId: launch.id });
    phone.at(95_500, { kind: "penalty", lane: 0, points: 100, reason: "Touched the ground in the safety area", cause: "object-in-safety-area", launchId: launch.id });
    const before = derive(phone.events, phone);
    // 90 + 120 s, only the 300 of the one attempt counts (F3K.4.3)
    expect(before.resultTenths).toBe(2100);
    expect(before.penaltyPoints).toBe(300);
    const after = derive([...phone.events, setAside(p300, 200_000, "The person was the pilot's own helper outside the area")], phone);
    expect(after.penaltyPoints).toBe(100); // the 100 of the same attempt now counts
    expect(after.derived.penalties?.map((p) => [p.points, p.applied])).toEqual([[100, true]]);
    expect(after.resultTenths).toBe(2100);
  });

  it("F3K.4.1 (RULES.md \"Penalties\": contact with a person at launch → round scores 0 plus the penalty): set aside, the run scores again", () => {
    const { phone, launch } = timed();
    const contact = phone.at(2000, { kind: "penalty", lane: 0, points: 100, reason: "Hit a person at launch", cause: "launch-contact", launchId: launch.id });
    const before = derive(phone.events, phone);
    expect(before.resultTenths).toBe(0);
    expect(before.penaltyPoints).toBe(100);
    const after = derive([...phone.events, setAside(contact, 200_000, "No contact: the model passed above")], phone);
    expect(after.resultTenths).toBe(2100);
    expect(after.penaltyPoints).toBe(0);
  });

  it("the timekeeper undoing the same penalty afterwards changes nothing; undoing that undo does not bring it back", () => {
    const { phone, launch } = timed();
    const p = phone.at(95_000, { kind: "penalty", lane: 0, points: 100, reason: "Outside the window", cause: "outside-time", launchId: launch.id });
    const officer = setAside(p, 200_000, "Launched inside the window");
    const undo = phone.at(210_000, { kind: "void", targetId: p.id });
    expect(derive([...phone.events, officer], phone).penaltyPoints).toBe(0);
    phone.at(220_000, { kind: "void", targetId: undo.id }); // the phone's redo: the officer's decision still stands
    expect(derive([...phone.events, officer], phone).penaltyPoints).toBe(0);
    expect(derive(phone.events, phone).penaltyPoints).toBe(100); // without the officer's event the redo would count it
  });

  it("the run page lists the set-aside penalty with the officer, when and why (setAsidePenalties); a plain undo is not listed", () => {
    const { phone, launch } = timed();
    const p = phone.at(95_000, { kind: "penalty", lane: 0, points: 300, reason: "Touched a helper", cause: "person-in-safety-area", launchId: launch.id });
    const other = phone.at(96_000, { kind: "penalty", lane: 0, points: 100, reason: "Early", cause: "outside-time" });
    phone.at(97_000, { kind: "void", targetId: other.id });
    const officer = setAside(p, 200_000, "Her own helper");
    const named = { ...officer, body: { ...officer.body, setAside: { reason: "Her own helper", by: "Ines Varga" } } } as DerivationEvent;
    expect(setAsidePenalties([...phone.events, named])).toEqual([{
      penaltyId: p.id, id: officer.id, lane: 0, points: 300, cause: "person-in-safety-area", penaltyReason: "Touched a helper", by: "Ines Varga", atMs: 200_000, why: "Her own helper",
    }]);
  });

  it("a phone cannot push a set-aside, nor amend one (lib/sync/authorise.ts)", () => {
    const run = { id: "run", createdBy: KEEPER, lanes: [{ lane: 0, pilotUserId: null }] };
    const body: EventBody = { kind: "void", targetId: nextId(), setAside: { reason: "mine" } };
    expect(eventRefusal(KEEPER, run, body, { runId: "run", recordedBy: KEEPER })).toMatch(/officer/);
    const officerEvent = { runId: "run", recordedBy: OFFICER, deviceId: officerDeviceId(nextId()) };
    expect(eventRefusal(KEEPER, run, { kind: "void", targetId: nextId() }, officerEvent)).toMatch(/officer/);
    expect(eventRefusal(KEEPER, run, { kind: "void", targetId: nextId() }, { runId: "run", recordedBy: KEEPER, deviceId: "keeper-phone" })).toBeNull();
  });

  it("a phone from before `setAside` reads the event as a plain undo (zod strips the key), so its fold agrees", () => {
    const { phone, launch } = timed();
    const p = phone.at(95_000, { kind: "penalty", lane: 0, points: 300, reason: "x", cause: "person-in-safety-area", launchId: launch.id });
    const officer = setAside(p, 200_000, "Set aside");
    const asOld = { ...officer, body: { kind: "void" as const, targetId: p.id } };
    expect(runEventSchema.safeParse({ ...officer, runId: nextId() }).success).toBe(true);
    expect(derive([...phone.events, asOld], phone)).toEqual(derive([...phone.events, officer], phone));
  });
});
