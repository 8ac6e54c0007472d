import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { GET as clubMatesRoute } from "@/app/api/club-mates/route";
import { actAs } from "./support/session";
import { demoUser, getPool } from "./support/db";

afterAll(async () => {
  await getPool().end();
});

describe("GET /api/club-mates", () => {
  it("is 401 signed out; lists everyone in the user's clubs (the user too), by name", async () => {
    actAs(null);
    expect((await clubMatesRoute()).status).toBe(401);
    actAs(await demoUser("ada@example.com"));
    const res = await clubMatesRoute();
    expect(res.status).toBe(200);
    const { mates } = (await res.json()) as { mates: { id: string; name: string }[] };
    const names = mates.map((m) => m.name);
    // The seeded club (db/seed/demo-people.ts): the officer, the coach and three pilots.
    for (const name of ["Ada Fenwick", "Tobi Okafor", "Lena Strand", "Mara Lindqvist", "Ines Varga"]) expect(names).toContain(name);
    expect(names).not.toContain("Site Admin"); // in no club
    expect(names).toEqual([...names].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
    expect(mates.find((m) => m.name === "Tobi Okafor")?.id).toBe((await demoUser("tobi@example.com")).id);
  });

  it("is empty for someone in no club", async () => {
    actAs(await demoUser("admin@example.com"));
    expect(await (await clubMatesRoute()).json()).toEqual({ mates: [] });
  });
});
