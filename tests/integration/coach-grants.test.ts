import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { GET as listGrants, POST as offer } from "@/app/api/coach-grants/route";
import { DELETE as revoke } from "@/app/api/coach-grants/[grantId]/route";
import { POST as claim } from "@/app/api/coach/claim/route";
import { GET as roster } from "@/app/api/coach/pilots/route";
import { GET as season } from "@/app/api/pilots/[pilotId]/season/route";
import { actAs, type MockSessionUser } from "./support/session";
import { db, freshUser, getPool, verifiedUser } from "./support/db";
import { coachesAnyone } from "@/db/queries/coach/grants";
import { insertOwnRun } from "./support/hangar-records";

afterAll(async () => {
  await getPool().end();
});

const json = (body: unknown) => new Request("http://test/api/coach-grants", { method: "POST", body: JSON.stringify(body) });
const seasonOf = (pilotId: string) =>
  season(new Request(`http://test/api/pilots/${pilotId}/season`), { params: Promise.resolve({ pilotId }) });
const rosterIds = async () => ((await (await roster()).json()) as { pilots: { pilotId: string }[] }).pilots.map((p) => p.pilotId);

async function grantsOf(user: MockSessionUser) {
  actAs(user);
  return ((await (await listGrants()).json()) as { grants: { id: string; kind: string; coachName?: string; email?: string }[] }).grants;
}

describe("a pilot grants a coach their season", () => {
  it("an e-mail offer reaches only the verified holder of the address: an unverified account with it gets nothing", async () => {
    const pilot = await verifiedUser("grant-pilot-v");
    const claimant = await freshUser("grant-unverified");
    actAs(pilot);
    expect((await offer(json({ kind: "email", email: claimant.email }))).status).toBe(201);
    actAs(claimant);
    expect(await coachesAnyone(db, claimant)).toBe(false);
    expect(await rosterIds()).toEqual([]);
    expect((await seasonOf(pilot.id)).status).toBe(404);
  });

  it("by e-mail: the same reply for an address with or without an account; the coach gets in on opening the desk; revoking is a 404 at once", async () => {
    const pilot = await verifiedUser("grant-pilot");
    const coach = await verifiedUser("grant-coach");
    actAs(pilot);
    const known = await offer(json({ kind: "email", email: coach.email.toUpperCase() }));
    const unknown = await offer(json({ kind: "email", email: `nobody-${coach.id}@example.com` }));
    expect([known.status, unknown.status]).toEqual([201, 201]);
    const shape = (b: { offer: Record<string, unknown> }) => Object.keys(b.offer).sort();
    expect(shape(await known.json())).toEqual(shape(await unknown.json()));
    expect((await grantsOf(pilot)).map((g) => g.kind)).toEqual(["email", "email"]);

    actAs(coach);
    expect((await seasonOf(pilot.id)).status).toBe(404); // an offer is not yet a grant
    expect(await rosterIds()).toEqual([pilot.id]); // opening the desk takes the offer up
    expect((await seasonOf(pilot.id)).status).toBe(200);

    const grants = await grantsOf(pilot);
    const held = grants.find((g) => g.kind === "grant");
    expect(held).toMatchObject({ coachName: coach.name });
    expect(grants.filter((g) => g.kind === "email")).toHaveLength(1);
    const res = await revoke(new Request("http://test", { method: "DELETE" }), { params: Promise.resolve({ grantId: held!.id }) });
    expect(res.status).toBe(204);
    actAs(coach);
    expect((await seasonOf(pilot.id)).status).toBe(404);
    expect(await rosterIds()).toEqual([]);
  });

  it("by one-time code: good once, for someone else; a wrong code is a 404", async () => {
    const pilot = await verifiedUser("code-pilot");
    const coach = await verifiedUser("code-coach");
    const other = await verifiedUser("code-other");
    await insertOwnRun(pilot.id);
    actAs(pilot);
    const { offer: made } = (await (await offer(json({ kind: "code" }))).json()) as { offer: { code: string } };
    expect(made.code).toMatch(/^[A-Z2-9]{4}-[A-Z2-9]{4}$/);
    const claimAs = (code: string) => claim(new Request("http://test/api/coach/claim", { method: "POST", body: JSON.stringify({ code }) }));
    expect((await claimAs(made.code)).status).toBe(404); // the pilot's own code does nothing for the pilot
    actAs(coach);
    expect((await claimAs("AAAA-AAAA")).status).toBe(404);
    expect((await claimAs(made.code.toLowerCase().replace("-", " "))).status).toBe(201);
    expect((await seasonOf(pilot.id)).status).toBe(200);
    actAs(other);
    expect((await claimAs(made.code)).status).toBe(404); // used
    expect((await seasonOf(pilot.id)).status).toBe(404);
  });

  it("limits one-time codes to 10 tries an hour per account: the 11th is a 429, even with the right code", async () => {
    const pilot = await verifiedUser("limit-pilot");
    const guesser = await verifiedUser("limit-guesser");
    actAs(pilot);
    const { offer: made } = (await (await offer(json({ kind: "code" }))).json()) as { offer: { code: string } };
    const claimAs = (code: string) => claim(new Request("http://test/api/coach/claim", { method: "POST", body: JSON.stringify({ code }) }));
    actAs(guesser);
    for (let i = 0; i < 10; i++) expect((await claimAs(`GUESS-${String(i).padStart(3, "2")}`.slice(0, 9))).status).toBe(404);
    const limited = await claimAs(made.code);
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await limited.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
    expect((await seasonOf(pilot.id)).status).toBe(404); // the right code, too late: no grant
  });

  it("limits offers to 20 an hour per account: the 21st is a 429 and makes no offer", async () => {
    const pilot = await verifiedUser("offer-limit");
    actAs(pilot);
    for (let i = 0; i < 20; i++) expect((await offer(json(i % 2 ? { kind: "code" } : { kind: "email", email: `coach${i}@example.org` }))).status).toBe(201);
    const limited = await offer(json({ kind: "email", email: "one-more@example.org" }));
    expect(limited.status).toBe(429);
    expect(((await limited.json()) as { error: { code: string } }).error.code).toBe("rate_limited");
    expect((await grantsOf(pilot)).filter((g) => g.kind === "email" || g.kind === "code")).toHaveLength(20);
  });

  it("refuses bad input with a 4xx and changes nothing; another pilot cannot revoke", async () => {
    const pilot = await verifiedUser("bad-pilot");
    actAs(pilot);
    expect((await offer(json({ kind: "email", email: "not an address" }))).status).toBe(422);
    expect((await offer(json({ kind: "email", email: pilot.email }))).status).toBe(422);
    expect((await offer(json({ kind: "fax" }))).status).toBe(422);
    const { offer: made } = (await (await offer(json({ kind: "code" }))).json()) as { offer: { id: string } };
    const stranger = await verifiedUser("bad-stranger");
    actAs(stranger);
    const res = await revoke(new Request("http://test", { method: "DELETE" }), { params: Promise.resolve({ grantId: made.id }) });
    expect(res.status).toBe(404);
    expect((await grantsOf(pilot)).map((g) => g.id)).toEqual([made.id]);
  });
});
