import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { users } from "@/db/schema";
import { GET as listUsersRoute } from "@/app/api/admin/users/route";
import { POST as signUpRoute } from "@/app/api/account/sign-up/route";
import { verifyPassword } from "@/lib/auth/password";
import { actAs } from "./support/session";
import { db, demoUser, getPool } from "./support/db";

afterAll(async () => {
  await getPool().end();
});

describe("GET /api/admin/users", () => {
  it("is 401 signed out, 403 for a pilot and 200 for an admin", async () => {
    actAs(null);
    const list = (q = "") => listUsersRoute(new Request(`http://test/api/admin/users?q=${q}`));
    expect((await list()).status).toBe(401);
    actAs(await demoUser("ada@example.com"));
    const forbidden = await list();
    expect(forbidden.status).toBe(403);
    expect((await forbidden.json()).error.code).toBe("forbidden");
    actAs(await demoUser("admin@example.com"));
    const ok = await list("mara@");
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { users: { email: string }[] };
    expect(body.users.map((u) => u.email)).toContain("mara@example.com");
  });
});

describe("POST /api/account/sign-up", () => {
  const post = (body: unknown) =>
    signUpRoute(new Request("http://test/api/account/sign-up", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } }));

  it("creates an account with an argon2id hash, never the password", async () => {
    const email = `kite-${Date.now()}@example.com`;
    const res = await post({ name: "Kite Ames", email: email.toUpperCase(), password: "thermal-hunter-42" });
    expect(res.status).toBe(201);
    const [row] = await db.select().from(users).where(eq(users.email, email));
    expect(row?.name).toBe("Kite Ames");
    expect(row?.passwordHash).toMatch(/^\$argon2id\$/);
    expect(await verifyPassword("thermal-hunter-42", row?.passwordHash)).toBe(true);
  });

  it("answers the same for a taken address and changes nothing", async () => {
    const before = await db.select().from(users).where(eq(users.email, "ada@example.com"));
    const res = await post({ name: "Someone Else", email: "ada@example.com", password: "another-password-1" });
    expect(res.status).toBe(201);
    const after = await db.select().from(users).where(eq(users.email, "ada@example.com"));
    expect(after).toEqual(before);
  });

  it("rejects a weak password with a clear message and writes nothing", async () => {
    const email = `weak-${Date.now()}@example.com`;
    const res = await post({ name: "Weak", email, password: "aaaaaaaaaaaa" });
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toBe("password: Use a less repetitive password.");
    expect(await db.select().from(users).where(eq(users.email, email))).toEqual([]);
  });
});
