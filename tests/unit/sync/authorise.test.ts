import { describe, expect, it } from "vitest";
import { eventRefusal, pilotRefusal, runSessionRefusal } from "@/lib/sync/authorise";

const run = { id: "run-1", createdBy: "keeper", lanes: [{ lane: 0, pilotUserId: "ada" }, { lane: 1, pilotUserId: null }] };

describe("eventRefusal", () => {
  it("lets the run's creator record for any lane of the run", () => {
    expect(eventRefusal("keeper", run, { kind: "launch", lane: 1 }, null)).toBeNull();
    expect(eventRefusal("keeper", run, { kind: "window-start" }, null)).toBeNull();
  });

  it("lets a lane's pilot self-time their own lane and the run's signals, not another lane", () => {
    expect(eventRefusal("ada", run, { kind: "launch", lane: 0 }, null)).toBeNull();
    expect(eventRefusal("ada", run, { kind: "window-start" }, null)).toBeNull();
    expect(eventRefusal("ada", run, { kind: "launch", lane: 1 }, null)).toMatch(/lane 2's pilot/);
  });

  it("refuses anyone else, and lanes the run does not have", () => {
    expect(eventRefusal("tobi", run, { kind: "launch", lane: 0 }, null)).toMatch(/neither created this run nor fly in it/);
    expect(eventRefusal("keeper", run, { kind: "landing", lane: 3 }, null)).toMatch(/Lane 4 is not part/);
  });

  it("undo and corrections need their target in the same run; a pilot may amend only their own records", () => {
    const targetId = "00000000-0000-7000-8000-000000000001";
    expect(eventRefusal("ada", run, { kind: "void", targetId }, null)).toMatch(/not in this run/);
    expect(eventRefusal("ada", run, { kind: "void", targetId }, { runId: "run-2", recordedBy: "ada" })).toMatch(/not in this run/);
    expect(eventRefusal("ada", run, { kind: "void", targetId }, { runId: "run-1", recordedBy: "ada" })).toBeNull();
    expect(eventRefusal("ada", run, { kind: "correct", targetId, wallMs: 1 }, { runId: "run-1", recordedBy: "keeper" })).toMatch(/timekeeper/);
    expect(eventRefusal("keeper", run, { kind: "void", targetId }, { runId: "run-1", recordedBy: "ada" })).toBeNull();
  });
});

describe("runSessionRefusal and pilotRefusal", () => {
  it("allows runs in one's own sessions only", () => {
    expect(runSessionRefusal("ada", { ownerId: "ada" })).toBeNull();
    expect(runSessionRefusal("ada", { ownerId: "ines" })).toMatch(/own sessions/);
    expect(runSessionRefusal("ada", null)).toMatch(/not on the server/);
  });

  it("names as pilot oneself or a club mate, never a stranger", () => {
    expect(pilotRefusal("ada", 0, "ada", false, true)).toBeNull();
    expect(pilotRefusal("ada", 1, "tobi", true, true)).toBeNull();
    expect(pilotRefusal("ada", 1, "stranger", false, true)).toMatch(/Lane 2: that pilot is not in a club with you/);
    // an unknown account id is answered exactly like a stranger, so pushes reveal no account's existence
    expect(pilotRefusal("ada", 0, "ghost", false, false)).toBe(pilotRefusal("ada", 0, "stranger", false, true));
  });
});
