import "fake-indexeddb/auto";
import "./support/session";
import { eq } from "drizzle-orm";
import { v7 as uuidv7 } from "uuid";
import { afterAll, describe, expect, it } from "vitest";
import { events, runDeletions, runs } from "@/db/schema";
import { listChanges } from "@/db/queries/sync-pull";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { deleteAccount } from "@/db/queries/account-delete";
import { discardUnstartedRun } from "@/lib/offline/discard";
import { createWindowcallDb, setMeta, type WindowcallDb } from "@/lib/offline/db";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { SyncClient } from "@/lib/offline/sync-client";
import { getCatalogueTask } from "@/lib/tasks";
import { freshClub, pullEverything, runItem } from "./consent-fixtures";
import { actAs, type MockSessionUser } from "./support/session";
import { db, getPool } from "./support/db";
import { push } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

/** A phone signed in as `user`, talking to the real push and pull route handlers. */
async function phone(user: MockSessionUser) {
  const device = createWindowcallDb(`discard-${uuidv7()}`);
  const fetch = async (url: string, init?: RequestInit) => {
    actAs(user); // the session is the phone's: several phones take turns in this process
    if (url === "/api/sync/push") return pushRoute(new Request(`http://test${url}`, init));
    if (url.startsWith("/api/sync/pull")) return pullRoute(new Request(`http://test${url}`, init));
    return new Response("{}", { status: 404 });
  };
  const client = new SyncClient({ db: device, fetch });
  await setMeta(device, "profile", { id: user.id, name: user.name, email: user.email });
  return { device, sync: () => client.sync(), status: () => client.status() };
}

/** `recorder` sets up a window (H) on `device` with `pilot` flying lane 0; nothing recorded in it yet. */
async function setUpWindow(device: WindowcallDb, recorder: MockSessionUser, pilot: MockSessionUser) {
  const session = await createSessionLocal(device, { ownerId: recorder.id, fieldName: "Discard Meadow", conditions: {}, startedAtWallMs: 1_767_000_000_000 });
  return createRunLocal(device, {
    sessionId: session.id, task: getCatalogueTask("H") as unknown as Record<string, unknown>,
    lanes: [{ lane: 0, pilotName: pilot.name, pilotUserId: pilot.id }], createdAtWallMs: 1_767_000_060_000,
  });
}

const stamp = (wallMs: number) => ({ wallMs, monoMs: 1000, pageId: "discard-page", offset: null });
const serverRun = async (id: string) => (await db.select({ id: runs.id }).from(runs).where(eq(runs.id, id)))[0];

describe("deleting a window that was set up but never started (ours: issue 10)", () => {
  it("leaves the server, the results and the partner's phone at its next pull", async () => {
    const [tobi, ada] = (await freshClub(["Tobi", "Ada"])) as [MockSessionUser, MockSessionUser];
    const tobisPhone = await phone(tobi);
    const adasPhone = await phone(ada);
    const run = await setUpWindow(tobisPhone.device, tobi, ada);
    await tobisPhone.sync();
    expect(await serverRun(run.id)).toBeDefined();
    await adasPhone.sync();
    expect(await adasPhone.device.runs.get(run.id)).toBeDefined(); // Ada's logbook lists it

    expect(await discardUnstartedRun(tobisPhone.device, run.id)).toBe("deleted");
    await tobisPhone.sync();
    expect(tobisPhone.status()).toMatchObject({ unsent: 0, rejected: [] });
    expect(await serverRun(run.id)).toBeUndefined();
    expect(await db.select().from(events).where(eq(events.runId, run.id))).toEqual([]);
    expect((await db.select().from(runDeletions).where(eq(runDeletions.runId, run.id))).length).toBe(1);
    // no result or list built from the server's rows can show it: neither pilot pulls it any more
    for (const who of [tobi, ada]) expect(runItem(await pullEverything(who.id), run.id)).toBeUndefined();

    await adasPhone.sync();
    expect(await adasPhone.device.runs.get(run.id)).toBeUndefined();
    expect(await adasPhone.device.sessions.count()).toBe(0); // Tobi's session held nothing else of hers
    // only those who could see it are told
    const [stranger] = (await freshClub(["Stranger"])) as [MockSessionUser];
    expect((await listChanges(db, { userId: stranger.id, cursor: "0" })).forget ?? []).not.toContain(run.id);
  });

  it("refuses to delete a started window, from the phone and on the server", async () => {
    const [tobi, ada] = (await freshClub(["Tobi", "Ada"])) as [MockSessionUser, MockSessionUser];
    const tobisPhone = await phone(tobi);
    const run = await setUpWindow(tobisPhone.device, tobi, ada);
    await recordEvent(tobisPhone.device, { runId: run.id, body: { kind: "window-start" }, stamp: stamp(1_767_000_100_000) });
    await tobisPhone.sync();
    expect(await discardUnstartedRun(tobisPhone.device, run.id)).toBe("started");

    // a phone that sends the deletion anyway (an older copy, a bug) is refused and nothing changes
    actAs(tobi);
    const res = await push({ deviceId: `test-device-${uuidv7()}`, sessions: [], runs: [], events: [], discards: [{ id: run.id }] });
    expect(res.status).toBe(200);
    expect(res.body.acks).toEqual([{ id: run.id, status: "rejected", reason: expect.stringMatching(/started/) }]);
    expect(await serverRun(run.id)).toBeDefined();
    expect((await db.select().from(events).where(eq(events.runId, run.id))).length).toBe(1);
    expect(await db.select().from(runDeletions).where(eq(runDeletions.runId, run.id))).toEqual([]);
  });

  it("only the account that set the window up may delete it; a replay changes nothing", async () => {
    const [tobi, ada] = (await freshClub(["Tobi", "Ada"])) as [MockSessionUser, MockSessionUser];
    const tobisPhone = await phone(tobi);
    const run = await setUpWindow(tobisPhone.device, tobi, ada);
    await tobisPhone.sync();

    actAs(ada); // the pilot in lane 0 sees the run, but did not set it up
    const byAda = await push({ deviceId: `test-device-${uuidv7()}`, sessions: [], runs: [], events: [], discards: [{ id: run.id }] });
    expect(byAda.body.acks).toEqual([{ id: run.id, status: "rejected", reason: expect.stringMatching(/set up this window/) }]);
    expect(await serverRun(run.id)).toBeDefined();

    actAs(tobi);
    const body = { deviceId: `test-device-${uuidv7()}`, sessions: [], runs: [], events: [], discards: [{ id: run.id }] };
    expect((await push(body)).body.acks).toEqual([{ id: run.id, status: "applied" }]);
    expect((await push(body)).body.acks).toEqual([{ id: run.id, status: "applied" }]);
    expect(await serverRun(run.id)).toBeUndefined();
    // a deletion that is not a run id is refused on its own, with the reason
    const odd = await push({ ...body, discards: [{ id: "not-a-run" }] });
    expect(odd.status).toBe(200);
    expect(odd.body.acks).toEqual([{ id: "not-a-run", status: "rejected", reason: expect.stringMatching(/^Invalid deletion: id/) }]);
  });
  it("deleting an account takes its id out of the deletions it could see (seen_by, deleted_by)", async () => {
    const [tobi, ada] = (await freshClub(["Tobi", "Ada"])) as [MockSessionUser, MockSessionUser];
    const tobisPhone = await phone(tobi);
    const run = await setUpWindow(tobisPhone.device, tobi, ada);
    await tobisPhone.sync();
    expect(await discardUnstartedRun(tobisPhone.device, run.id)).toBe("deleted");
    await tobisPhone.sync();
    const row = async () => (await db.select().from(runDeletions).where(eq(runDeletions.runId, run.id)))[0]!;
    expect((await row()).seenBy.sort()).toEqual([tobi.id, ada.id].sort());

    expect(await deleteAccount(db, ada.id)).toBe(true);
    expect(await row()).toMatchObject({ seenBy: [tobi.id], deletedBy: tobi.id });
    expect(await deleteAccount(db, tobi.id)).toBe(true);
    expect(await row()).toMatchObject({ seenBy: [], deletedBy: null });
    // the row itself stays: a replayed deletion of the run still finds it and is answered "applied"
    expect((await listChanges(db, { userId: tobi.id, cursor: "0" })).forget ?? []).not.toContain(run.id);
  });
});
