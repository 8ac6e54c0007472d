import { describe, expect, it } from "vitest";
import { readSessionUser } from "@/lib/security/session-user";

describe("readSessionUser (next-auth's GET /api/auth/session answer)", () => {
  it("reads the signed-in user", () => {
    const body = { user: { id: "u1", name: "Ada", email: "ada@example.com", role: "admin", sessionVersion: 3 }, expires: "2027-01-01T00:00:00.000Z" };
    expect(readSessionUser(body)).toEqual({ id: "u1", name: "Ada", email: "ada@example.com", role: "admin" });
  });

  it("signed out is `{}`: no user", () => {
    expect(readSessionUser({})).toBeNull();
  });

  it("anything else is no user: null, a string, a user without an id", () => {
    expect(readSessionUser(null)).toBeNull();
    expect(readSessionUser("<html>")).toBeNull();
    expect(readSessionUser({ user: { name: "Ada" } })).toBeNull();
    expect(readSessionUser({ user: { id: "" } })).toBeNull();
  });

  it("a missing name or e-mail reads as empty, an unknown role as member", () => {
    expect(readSessionUser({ user: { id: "u2", role: "owner" } })).toEqual({ id: "u2", name: "", email: "", role: "member" });
  });
});
