import { describe, expect, it } from "vitest";
import { clubSlug } from "@/lib/clubs/slug";
import { hasClubRole, leavesAnOfficer } from "@/lib/clubs/roles";
import { clubFieldSchema, clubSlugSchema, createClubSchema } from "@/lib/validations/clubs";

describe("club slugs", () => {
  it("turns a name into an address name that the route's schema accepts", () => {
    for (const [name, slug] of [
      ["Heronmoor Hand-Launch Club", "heronmoor-hand-launch-club"],
      ["  Ørsted  Flyers!! ", "rsted-flyers"],
      ["Club Aéro Süd", "club-aero-sud"],
      ["!!!", "club"],
      ["x".repeat(100), "x".repeat(48)],
    ] as const) {
      expect(clubSlug(name)).toBe(slug);
      expect(clubSlugSchema.safeParse(clubSlug(name)).success).toBe(true);
    }
    expect(clubSlug("Kestrel Downs", 3)).toBe("kestrel-downs-3");
  });

  it("never ends in a hyphen when cut", () => {
    expect(clubSlug(`${"a".repeat(47)} b`)).toBe("a".repeat(47));
  });
});

describe("club roles", () => {
  it("ranks officer over coach over member", () => {
    expect(hasClubRole("officer", "coach")).toBe(true);
    expect(hasClubRole("coach", "officer")).toBe(false);
    expect(hasClubRole("member", "member")).toBe(true);
    expect(hasClubRole(null, "member")).toBe(false);
  });

  it("keeps the last officer", () => {
    expect(leavesAnOfficer(1, "officer", null)).toBe(false);
    expect(leavesAnOfficer(1, "officer", "member")).toBe(false);
    expect(leavesAnOfficer(2, "officer", null)).toBe(true);
    expect(leavesAnOfficer(1, "member", null)).toBe(true);
    expect(leavesAnOfficer(1, "officer", "officer")).toBe(true);
  });
});

describe("club forms", () => {
  it("reads typed coordinates and empty notes", () => {
    const out = clubFieldSchema.parse({ name: " North Meadow ", latitude: "52,123456", longitude: "", launchDirection: "  ", safetyAreas: "Car park", localRules: "" });
    expect(out).toEqual({ name: "North Meadow", latitude: 52.12346, longitude: null, launchDirection: null, safetyAreas: "Car park", localRules: null });
  });

  it("refuses what a column cannot hold, with a sentence", () => {
    const bad = clubFieldSchema.safeParse({ name: "A\u0000B", latitude: 91 });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues.map((i) => i.message).join(" ")).toMatch(/Latitude is a number from −90 to 90/);
    expect(createClubSchema.safeParse({ name: "x" }).error?.issues[0]?.message).toMatch(/at least 2/);
  });
});
