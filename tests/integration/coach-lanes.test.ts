import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { listChanges } from "@/db/queries/sync-pull";
import { actAs } from "./support/session";
import { db, demoUser, getPool } from "./support/db";
import { decide, freshClub, grant, pullEverything, runItem } from "./consent-fixtures";
import { pushingAs, T0 } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

describe("a coach sees a shared run lane by lane", () => {
  it("Mara (grants from Ada and Tobi) sees Ada's lane of a window Ada flew with Lena, and nothing of Lena's", async () => {
    const ada = await demoUser("ada@example.com");
    const lena = await demoUser("lena@example.com");
    const mara = await demoUser("mara@example.com");
    const { phone, run: r, send } = pushingAs(ada, [
      { lane: 0, pilotName: "Ada Fenwick", pilotUserId: ada.id },
      { lane: 1, pilotName: "Lena Strand", pilotUserId: lena.id },
    ]);
    const lenaFlights = phone.flights(r.id, 1, [70, 80], T0 + 1500);
    const events = [
      phone.at(r.id, T0, { kind: "window-start" }),
      ...phone.flights(r.id, 0, [60, 120], T0 + 1000),
      ...lenaFlights,
      phone.at(r.id, T0 + 200_000, { kind: "correct", targetId: lenaFlights[1]!.id, wallMs: T0 + 70_000 }),
      phone.at(r.id, T0 + 201_000, { kind: "penalty", lane: 1, points: 100, reason: "Lena's own business" }),
    ];
    const undo = phone.at(r.id, T0 + 202_000, { kind: "void", targetId: events.at(-1)!.id });
    const redo = phone.at(r.id, T0 + 203_000, { kind: "void", targetId: undo.id });
    const res = await send([...events, undo, redo]);
    expect(res.body.acks.every((a) => a.status === "applied")).toBe(true);

    const items = await pullEverything(mara.id);
    const seen = runItem(items, r.id);
    expect(seen?.data.lanes).toEqual([{ lane: 0, pilotName: "Ada Fenwick", pilotUserId: ada.id }]);
    expect(seen?.results?.map((x) => x.lane)).toEqual([0]);
    expect(seen?.consents).toEqual([{ lane: 0, status: "own", reason: null }]);
    expect(JSON.stringify(seen)).not.toMatch(/Lena|lena/);
    expect(JSON.stringify(seen)).not.toContain(lena.id);
    const eventIds = new Set(items.flatMap((i) => (i.type === "event" && i.data.runId === r.id ? [i.data.id] : [])));
    const lenaIds = [...lenaFlights, events.at(-2)!, events.at(-1)!, undo, redo].map((e) => e.id);
    expect(lenaIds.filter((id) => eventIds.has(id))).toEqual([]);
    expect(eventIds.size).toBe(1 + 4); // the signal and Ada's two flights

    // Ada, who flew it, still sees the whole run
    const full = runItem(await pullEverything(ada.id), r.id);
    expect(full?.data.lanes.map((l) => l.lane)).toEqual([0, 1]);
  });

  it("a run a club mate recorded for the pilot reaches the coach only once the pilot accepts it, and the scope says so", async () => {
    const [tobi, ada, coach] = await freshClub(["Tobi", "Ada", "Coach"]);
    await grant(ada!, coach!);
    const { phone, run: r, send } = pushingAs(tobi!, [{ lane: 0, pilotName: "Ada", pilotUserId: ada!.id }]);
    await send([phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [60], T0 + 1000)]);
    const before = await listChanges(db, { userId: coach!.id, cursor: 0 });
    expect(runItem(await pullEverything(coach!.id), r.id)).toBeUndefined();
    actAs(ada!);
    expect((await decide(r.id, 0, { decision: "accepted" })).status).toBe(200);
    const after = await listChanges(db, { userId: coach!.id, cursor: 0 });
    expect(after.scope).not.toBe(before.scope);
    const items = await pullEverything(coach!.id);
    expect(runItem(items, r.id)?.consents).toEqual([{ lane: 0, status: "accepted", reason: null }]);
    expect(items.filter((i) => i.type === "event" && i.data.runId === r.id)).toHaveLength(3);
  });
});
