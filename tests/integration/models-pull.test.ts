import "./support/session";
import "fake-indexeddb/auto";
import { v7 as uuidv7 } from "uuid";
import { afterAll, describe, expect, it } from "vitest";
import { GET as pullRoute } from "@/app/api/sync/pull/route";
import { POST as addModel } from "@/app/api/models/route";
import { PATCH as patchModel } from "@/app/api/models/[modelId]/route";
import { createWindowcallDb } from "@/lib/offline/db";
import { cachedModels } from "@/lib/offline/models-cache";
import { pullAll } from "@/lib/offline/pull";
import { actAs, type MockSessionUser } from "./support/session";
import { freshUser, getPool } from "./support/db";

afterAll(async () => {
  await getPool().end();
});

/** One phone of `user`: its own device database, pulling through the real route. */
function phoneOf(user: MockSessionUser) {
  const db = createWindowcallDb(`models-${uuidv7()}`);
  const sync = async () => {
    const outcome = await pullAll({ db, account: user.id, fetch: async (url: string) => (actAs(user), pullRoute(new Request(`http://test${url}`))) });
    expect(outcome.kind).toBe("ok");
  };
  return { db, sync, names: async () => (await cachedModels(db)).map((m) => `${m.name}:${m.status}`) };
}

const json = (method: string, body: unknown) => new Request("http://test/api/models", { method, body: JSON.stringify(body), headers: { "content-type": "application/json" } });

describe("a pilot's models reach their other phones through the pull", () => {
  it("a model added on one phone is listed on the second after a pull; a status change follows; another pilot's phone gets none", async () => {
    const pilot = await freshUser("models-pull");
    const other = await freshUser("models-pull-other");
    const first = phoneOf(pilot);
    const second = phoneOf(pilot);
    const stranger = phoneOf(other);
    await second.sync();
    expect(await second.names()).toEqual([]);

    actAs(pilot); // added with signal on the first phone
    const added = await addModel(json("POST", { name: "Pulled Heron", spanMm: 1490, massG: 250, marking: "", notes: "", status: "flying" }));
    expect(added.status).toBe(201);
    const { model } = (await added.json()) as { model: { id: string } };

    await second.sync();
    expect(await second.names()).toEqual(["Pulled Heron:flying"]);
    await first.sync();
    expect(await first.names()).toEqual(["Pulled Heron:flying"]);

    actAs(pilot);
    const patched = await patchModel(json("PATCH", { status: "sold" }), { params: Promise.resolve({ modelId: model.id }) });
    expect(patched.status).toBe(200);
    await second.sync(); // nothing else changed: the hangar still comes with the (empty) last page
    expect(await second.names()).toEqual(["Pulled Heron:sold"]);

    await stranger.sync();
    expect(await stranger.names()).toEqual([]);
  });
});
