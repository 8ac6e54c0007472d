/**
 * The invented demo club. Every name here is made up for the demo; any likeness is chance.
 * All demo accounts share one password (README lists them).
 */
export const DEMO_PASSWORD = "windowcall-demo";

export const DEMO_CLUB = { name: "Heronmoor Hand-Launch Club", slug: "heronmoor", homeField: "Five Acre Meadow" };

export type DemoPerson = {
  key: string;
  name: string;
  email: string;
  globalRole: "member" | "admin";
  clubRole: "member" | "coach" | "officer" | null;
  /** 0..1: how close to the targets this pilot flies and how fast they relaunch. */
  skill: number | null;
};

export const DEMO_PEOPLE: DemoPerson[] = [
  { key: "officer", name: "Ines Varga", email: "ines@example.com", globalRole: "member", clubRole: "officer", skill: null },
  { key: "coach", name: "Mara Lindqvist", email: "mara@example.com", globalRole: "member", clubRole: "coach", skill: null },
  { key: "ada", name: "Ada Fenwick", email: "ada@example.com", globalRole: "member", clubRole: "member", skill: 0.85 },
  { key: "tobi", name: "Tobi Okafor", email: "tobi@example.com", globalRole: "member", clubRole: "member", skill: 0.6 },
  { key: "lena", name: "Lena Strand", email: "lena@example.com", globalRole: "member", clubRole: "member", skill: 0.4 },
  { key: "admin", name: "Site Admin", email: "admin@example.com", globalRole: "admin", clubRole: null, skill: null },
];
