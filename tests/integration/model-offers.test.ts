import "./support/session";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { DELETE as withdraw, POST as offer } from "@/app/api/models/[modelId]/transfer/route";
import { POST as answer } from "@/app/api/model-offers/[offerId]/route";
import { GET as getModel } from "@/app/api/models/[modelId]/route";
import { exportAccount } from "@/db/queries/account-export";
import { addRepair } from "@/db/queries/models";
import { listOffersToMe } from "@/db/queries/model-offers";
import { altimeterLogs, launchHeights, modelOffers, modelRepairs, models, users } from "@/db/schema";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool, verifiedUser } from "./support/db";
import { insertLog, insertModel } from "./support/hangar-records";

afterAll(async () => {
  await getPool().end();
});

const post = (body: unknown) => new Request("http://test/api", { method: "POST", body: JSON.stringify(body) });
const offerTo = (modelId: string, email: string, withHistory = false) => offer(post({ email, withHistory }), { params: Promise.resolve({ modelId }) });
const answerAs = (offerId: string, a: "accept" | "decline") => answer(post({ answer: a }), { params: Promise.resolve({ offerId }) });
const modelStatus = async (modelId: string) => (await getModel(new Request("http://test"), { params: Promise.resolve({ modelId }) })).status;

/** A model of the seller's with history: a repair and a launch height from a parsed log. */
async function modelWithHistory(seller: MockSessionUser) {
  const modelId = await insertModel(seller.id, "Offer glider");
  await addRepair(db, { ownerId: seller.id, modelId, repair: { repairedOn: "2026-05-01", work: "new nose", massAfterG: 244 } });
  const logId = await insertLog(seller.id, "parsed");
  const [log] = await db.select().from(altimeterLogs).where(eq(altimeterLogs.id, logId));
  await db.insert(launchHeights).values({ logId, runId: log!.runId, lane: 0, atMs: 1_767_000_000_000, heightM: 55.5, flightIndex: 0, gapMs: 200, modelId });
  return modelId;
}

async function offersOf(user: MockSessionUser) {
  return listOffersToMe(db, { user });
}

describe("offering a model to another account", () => {
  it("reaches only the verified holder of the address: an account that signed up with it unverified sees nothing and cannot accept", async () => {
    const seller = await verifiedUser("offer-seller-v");
    const claimant = await freshUser("offer-unverified");
    actAs(seller);
    const modelId = await insertModel(seller.id);
    expect((await offerTo(modelId, claimant.email)).status).toBe(202);
    const [made] = await db.select({ id: modelOffers.id }).from(modelOffers).where(eq(modelOffers.modelId, modelId));
    expect(await offersOf(claimant)).toEqual([]);
    actAs(claimant);
    expect((await answerAs(made!.id, "accept")).status).toBe(404);
    actAs(seller);
    expect(await modelStatus(modelId)).toBe(200); // still the seller's
    // once the address is verified, the same offer is theirs to take
    await db.update(users).set({ emailVerifiedAt: new Date() }).where(eq(users.id, claimant.id));
    expect((await offersOf(claimant)).map((o) => o.id)).toEqual([made!.id]);
  });

  it("answers alike for an address with an account and one without, and tells the seller nothing more", async () => {
    const seller = await verifiedUser("offer-seller");
    const buyer = await verifiedUser("offer-buyer");
    actAs(seller);
    const a = await insertModel(seller.id);
    const b = await insertModel(seller.id);
    const known = await offerTo(a, buyer.email.toUpperCase());
    const unknown = await offerTo(b, `nobody-${buyer.id}@example.com`);
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(known.status);
    expect(await unknown.text()).toBe(await known.text());
    // nothing moved yet: the seller still has both, the buyer sees an offer waiting
    expect([await modelStatus(a), await modelStatus(b)]).toEqual([200, 200]);
    expect((await offersOf(buyer)).map((o) => o.modelName)).toEqual(["Matrix glider"]);
  });

  it("accepting with its history moves the model, its repairs, launch heights and flights", async () => {
    const seller = await verifiedUser("offer-seller-h");
    const buyer = await verifiedUser("offer-buyer-h");
    const modelId = await modelWithHistory(seller);
    actAs(seller);
    expect((await offerTo(modelId, buyer.email, true)).status).toBe(202);
    actAs(buyer);
    expect(await modelStatus(modelId)).toBe(404); // not theirs until they accept
    const [waiting] = await offersOf(buyer);
    expect(waiting).toMatchObject({ modelName: "Offer glider", sellerName: seller.name, withHistory: true, massG: 244 });
    const res = await answerAs(waiting!.id, "accept");
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ answer: "accepted", modelId });
    expect(await modelStatus(modelId)).toBe(200);
    const [row] = await db.select().from(models).where(eq(models.id, modelId));
    expect(row).toMatchObject({ ownerId: buyer.id, status: "flying", formerOwnerIds: [seller.id] });
    expect(await db.select().from(modelRepairs).where(eq(modelRepairs.modelId, modelId))).toHaveLength(1);
    expect(await db.select().from(launchHeights).where(eq(launchHeights.modelId, modelId))).toHaveLength(1);
    actAs(seller);
    expect(await modelStatus(modelId)).toBe(404);
    // answered once: a second answer finds nothing
    actAs(buyer);
    expect((await answerAs(waiting!.id, "decline")).status).toBe(404);
  });

  it("accepting without history gives the buyer a fresh model; the seller keeps the sold one with its history", async () => {
    const seller = await verifiedUser("offer-seller-n");
    const buyer = await verifiedUser("offer-buyer-n");
    const modelId = await modelWithHistory(seller);
    actAs(seller);
    await offerTo(modelId, buyer.email, false);
    actAs(buyer);
    const [waiting] = await offersOf(buyer);
    const body = (await (await answerAs(waiting!.id, "accept")).json()) as { modelId: string };
    expect(body.modelId).not.toBe(modelId);
    const [copy] = await db.select().from(models).where(eq(models.id, body.modelId));
    expect(copy).toMatchObject({ ownerId: buyer.id, name: "Offer glider", massG: 244, formerOwnerIds: [] });
    expect(await db.select().from(modelRepairs).where(eq(modelRepairs.modelId, body.modelId))).toHaveLength(0);
    expect(await db.select().from(launchHeights).where(eq(launchHeights.modelId, body.modelId))).toHaveLength(0);
    const [old] = await db.select().from(models).where(eq(models.id, modelId));
    expect(old).toMatchObject({ ownerId: seller.id, status: "sold" });
    expect(await db.select().from(modelRepairs).where(eq(modelRepairs.modelId, modelId))).toHaveLength(1);
  });

  it("declining or withdrawing leaves the model where it was; a third party gets 404", async () => {
    const seller = await verifiedUser("offer-seller-d");
    const buyer = await verifiedUser("offer-buyer-d");
    const third = await verifiedUser("offer-third");
    const modelId = await modelWithHistory(seller);
    const ownerOf = async () => (await db.select({ o: models.ownerId, s: models.status }).from(models).where(eq(models.id, modelId)))[0];

    actAs(seller);
    await offerTo(modelId, buyer.email, true);
    const [first] = await offersOf(buyer);
    actAs(third);
    expect((await answerAs(first!.id, "accept")).status).toBe(404);
    expect((await withdraw(new Request("http://test", { method: "DELETE" }), { params: Promise.resolve({ modelId }) })).status).toBe(404);
    expect((await offerTo(modelId, buyer.email)).status).toBe(404); // not their model to offer
    expect((await offerTo(modelId, third.email)).status).toBe(404); // not even to their own address
    actAs(buyer);
    expect((await answerAs(first!.id, "decline")).status).toBe(200);
    expect(await ownerOf()).toEqual({ o: seller.id, s: "flying" });
    expect(await offersOf(buyer)).toEqual([]);

    actAs(seller);
    await offerTo(modelId, buyer.email, true);
    const [second] = await offersOf(buyer);
    expect((await withdraw(new Request("http://test", { method: "DELETE" }), { params: Promise.resolve({ modelId }) })).status).toBe(200);
    expect(await offersOf(buyer)).toEqual([]);
    actAs(buyer);
    expect((await answerAs(second!.id, "accept")).status).toBe(404); // withdrawn before the answer
    expect(await ownerOf()).toEqual({ o: seller.id, s: "flying" });
    const answers = await db.select({ a: modelOffers.answer }).from(modelOffers).where(eq(modelOffers.modelId, modelId));
    expect(answers.map((x) => x.a).sort()).toEqual(["declined", "withdrawn"]);
    // the seller's account export carries the offers they made
    const exported = (await exportAccount(db, seller.id))!.hangar;
    expect(exported.modelOffers.map((o) => [o.modelId, o.email, o.answer]).sort()).toEqual([[modelId, buyer.email, "declined"], [modelId, buyer.email, "withdrawn"]]);
  });

  it("a new offer of the same model replaces the waiting one; your own address is refused", async () => {
    const seller = await verifiedUser("offer-seller-r");
    const one = await verifiedUser("offer-one");
    const two = await verifiedUser("offer-two");
    const modelId = await insertModel(seller.id);
    actAs(seller);
    await offerTo(modelId, one.email);
    await offerTo(modelId, two.email);
    expect(await offersOf(one)).toEqual([]);
    expect(await offersOf(two)).toHaveLength(1);
    expect((await offerTo(modelId, seller.email)).status).toBe(422);
  });
});
