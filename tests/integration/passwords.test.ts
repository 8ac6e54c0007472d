import "./support/session";
import bcrypt from "bcryptjs";
import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { users } from "@/db/schema";
import { db, getPool } from "./support/db";
import { makeAccount, withTrustProxy } from "./support/accounts";
import { attempt } from "./support/sign-in";

afterAll(async () => {
  await getPool().end();
});

const hashOf = async (email: string) => (await db.select().from(users).where(eq(users.email, email)))[0]?.passwordHash;

describe("password hashes", () => {
  it("a bcrypt hash from before argon2id is upgraded at the next successful sign-in", async () => {
    const email = await makeAccount("legacy", "", await bcrypt.hash("old-but-good-pass", 10));
    await withTrustProxy(null, async () => {
      expect(await attempt(email, "not-the-password")).toBe("wrong");
      expect(await hashOf(email)).toMatch(/^\$2[aby]\$10\$/); // a failure changes nothing
      expect(await attempt(email, "old-but-good-pass")).toBe("signed in");
      expect(await hashOf(email)).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
      expect(await attempt(email, "old-but-good-pass")).toBe("signed in");
      expect(await attempt(email, "not-the-password")).toBe("wrong");
    });
  });

  it("the seed stores argon2id hashes", async () => {
    expect(await hashOf("lena@example.com")).toMatch(/^\$argon2id\$/);
  });
});
