import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { signInAs } from "./support/auth";

/**
 * The Coach desk as its two users use it (db/seed: Mara coaches, Ada and Tobi grant her; Lena does
 * not): Lena offers her season to Mara's e-mail from Settings; Mara opens the Coach desk, finds
 * Lena on her roster and taps into Lena's Season; Lena revokes, and Mara's next request — the
 * page and its route — is a 404. axe finds no serious violations on /coach.
 */

test.use({ viewport: { width: 360, height: 800 } });

async function noSeriousViolations(page: Page, what: string) {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${what}: ${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
}

test("a pilot grants a coach, the coach reads the pilot's Season, and after the revoke gets a 404", async ({ browser }) => {
  const pilotContext = await browser.newContext();
  const coachContext = await browser.newContext();
  const pilot = await pilotContext.newPage();
  const coach = await coachContext.newPage();

  await signInAs(pilot, "lena@example.com");
  await pilot.goto("/settings");
  const coaches = pilot.getByRole("region", { name: "Coaches" });
  await expect(coaches.getByText("Only you see your season.")).toBeVisible();
  await coaches.getByLabel("Coach's e-mail").fill("mara@example.com");
  await coaches.getByRole("button", { name: "Offer my season" }).click();
  await expect(coaches.getByRole("status")).toContainText("Offered to mara@example.com");
  await expect(coaches.getByRole("listitem").filter({ hasText: "waiting for that coach" })).toHaveCount(1);

  await signInAs(coach, "mara@example.com");
  await coach.goto("/coach");
  const roster = coach.getByRole("table", { name: "Pilots who let you see their season" });
  await expect(roster.getByRole("link", { name: "Ada Fenwick" })).toBeVisible();
  await expect(roster.getByRole("link", { name: "Lena Strand" })).toBeVisible();
  await noSeriousViolations(coach, "/coach");
  await roster.getByRole("link", { name: "Lena Strand" }).click();
  await expect(coach.getByRole("heading", { name: "Season of Lena Strand" })).toBeVisible();
  const lenaId = new URL(coach.url()).searchParams.get("pilot")!;
  expect(lenaId).toMatch(/^[0-9a-f-]{36}$/);
  expect((await coach.request.get(`/api/pilots/${lenaId}/season`)).status()).toBe(200);

  await pilot.reload();
  await coaches.getByRole("button", { name: "Revoke Mara Lindqvist" }).click();
  await expect(coaches.getByRole("status")).toContainText("Revoked");
  await expect(coaches.getByText("Only you see your season.")).toBeVisible();

  expect((await coach.request.get(`/api/pilots/${lenaId}/season`)).status()).toBe(404);
  const page = await coach.goto(`/season?pilot=${lenaId}`);
  expect(page?.status()).toBe(404);
  await coach.goto("/coach");
  await expect(roster.getByRole("link", { name: "Ada Fenwick" })).toBeVisible();
  await expect(roster.getByRole("link", { name: "Lena Strand" })).toHaveCount(0);

  await pilotContext.close();
  await coachContext.close();
});
