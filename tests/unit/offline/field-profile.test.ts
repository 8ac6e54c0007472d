import { describe, expect, it } from "vitest";
import { fieldProfileOf } from "@/lib/offline/field-profile";

const ada = { id: "u-ada", name: "Ada Wren" };
const kept = { ...ada, email: "ada@example.com" };

describe("fieldProfileOf (who sets up a window on this phone)", () => {
  it("a phone that has just signed in: the session's user, before the device has stored the profile", () => {
    // the case a fresh phone hit when the set-up button was pressed before the account check had written the profile
    expect(fieldProfileOf(null, { status: "authenticated", user: ada })).toEqual({ profile: ada, loading: false });
  });
  it("no signal: the profile kept on the device", () => {
    expect(fieldProfileOf(kept, { status: "unauthenticated", user: null })).toEqual({ profile: ada, loading: false });
    expect(fieldProfileOf(kept, { status: "loading", user: null })).toEqual({ profile: ada, loading: false });
  });
  it("another account signed in on a phone that kept someone else: the signed-in one", () => {
    const other = { id: "u-other", name: "Bo Lind", email: "bo@example.com" };
    expect(fieldProfileOf(other, { status: "authenticated", user: ada })).toEqual({ profile: ada, loading: false });
  });
  it("waits while neither the device nor the session has answered", () => {
    expect(fieldProfileOf(undefined, { status: "unauthenticated", user: null })).toEqual({ profile: null, loading: true });
    expect(fieldProfileOf(null, { status: "loading", user: null })).toEqual({ profile: null, loading: true });
  });
  it("never signed in on this phone and no signal: nobody, and done loading (the form says to sign in once)", () => {
    expect(fieldProfileOf(null, { status: "unauthenticated", user: null })).toEqual({ profile: null, loading: false });
  });
});
