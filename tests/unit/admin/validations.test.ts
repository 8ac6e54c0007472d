import { describe, expect, it } from "vitest";
import { adminUserActionSchema, userSearchSchema } from "@/lib/validations/admin";

describe("admin input", () => {
  it("reads the search from query parameters, with defaults", () => {
    expect(userSearchSchema.parse({})).toEqual({ q: "", page: 1 });
    expect(userSearchSchema.parse({ q: "  Ada ", page: "3" })).toEqual({ q: "Ada", page: 3 });
  });

  it.each([{ page: "0" }, { page: "1.5" }, { page: "501" }, { page: "1e400" }, { q: "x".repeat(201) }, { q: "a\u0000b" }])(
    "refuses %o",
    (query) => expect(userSearchSchema.safeParse(query).success).toBe(false),
  );

  it("takes one change per request and nothing else", () => {
    expect(adminUserActionSchema.parse({ action: "set-role", role: "admin", extra: 1 })).toEqual({ action: "set-role", role: "admin" });
    expect(adminUserActionSchema.safeParse({ action: "set-role", role: "owner" }).success).toBe(false);
    expect(adminUserActionSchema.safeParse({ action: "delete" }).success).toBe(false);
  });
});
