import { expect, test } from "@playwright/test";
import pg from "pg";
import { sameOrigin } from "./support/api";
import { signInAs } from "./support/auth";
import { insertPenaltyTrial, phonePenaltyRun } from "./support/phone-penalty";

/**
 * Issue #15: an officer sets aside a penalty a timekeeper's phone gave. Ines (the demo club's officer) keeps
 * Tam's time on her phone (pushed here through the sync API): a 150.0 s flight and a contact with a person at
 * launch, which zeroes the round plus 100 points (F3K.4.1, RULES.md "Penalties"). On the round's page she sets
 * it aside, saying why: the list strikes it through with who, when and why, the results total follows the run
 * derived again (not a subtraction), and the run page on her phone shows the officer's decision once it pulled it.
 */
test.describe.configure({ timeout: 180_000 });

test("an officer sets aside the phone's launch-contact penalty: struck through with who and why, the run scores again, her phone shows the decision", async ({ page, baseURL }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    // invented pilots: two signed paper cards of task A (tenths); Tam is timed on Ines's phone
    const { contestId, round1, inesId, ids, task } = await insertPenaltyTrial(db, { name: "Set Aside Trial", startsOn: "2027-03-13", drawSeed: 7 });
    await signInAs(page, "ines@example.com");
    const run = phonePenaltyRun({
      userId: inesId, roundId: round1, entryId: ids["Tam Ossory"]!, pilotName: "Tam Ossory", task, secs: 150, penalty: { reason: "Model hit a helper at launch", cause: "launch-contact" },
    });
    const pushed = await page.request.post("/api/sync/push", { headers: sameOrigin(baseURL), data: run.body });
    expect(pushed.status()).toBe(200);
    expect(((await pushed.json()) as { acks: { status: string }[] }).acks.every((a) => a.status === "applied")).toBe(true);

    // By hand (F3K.9.1, F3K.10, F3K.4.1): Sol 200.0 s = 1000.0; Wren 180.0/200.0 = 900.0; Tam's round scores 0, less 100 = −100.0.
    const total = (name: string) => page.getByRole("row").filter({ has: page.getByRole("rowheader", { name }) }).first().getByRole("cell").last();
    await page.goto(`/contests/${contestId}/results`);
    await expect(total("Tam Ossory")).toHaveText("-100.0");
    await expect(total("Sol Penhallow")).toHaveText("1000.0");

    // The round page: Ines sets the phone's penalty aside, saying why.
    await page.goto(`/contests/${contestId}/rounds/1`);
    const tam = page.getByRole("region", { name: "Penalties" }).getByRole("listitem", { name: "Penalty, Tam Ossory" });
    await expect(tam).toContainText("given on the timekeeper's phone by Ines Varga");
    const form = tam.getByRole("form", { name: "Set aside the phone's penalty, Tam Ossory" });
    // typed once the page is interactive (text typed before hydration is lost)
    await expect(async () => {
      await form.getByLabel("Why it is set aside").fill("The model passed above the helper");
      await expect(form.getByRole("button", { name: "Set aside" })).toBeEnabled({ timeout: 1000 });
    }).toPass();
    await form.getByRole("button", { name: "Set aside" }).click();
    await expect(tam).toContainText("set aside by Ines Varga");
    await expect(tam).toContainText("The model passed above the helper");
    await expect(tam).toContainText("not counted (set aside)");
    await expect(tam.locator(".line-through")).toHaveCount(1);
    await expect(tam.getByRole("button", { name: "Set aside" })).toHaveCount(0);

    // Results: the run derived again — Tam's 150.0 s counts: 150.0/200.0 = 750.0, no penalty.
    await page.goto(`/contests/${contestId}/results`);
    await expect(total("Tam Ossory")).toHaveText("750.0");
    await expect(total("Wren Albery")).toHaveText("900.0");
    await page.getByText("Penalties (1)").click();
    await expect(page.getByRole("list", { name: "Penalties" })).toContainText("set aside by Ines Varga");

    // Her phone (this browser) pulls the decision: the run page scores 150.0 s and shows who set the penalty aside and why.
    await page.goto(`/logbook/run?id=${run.runId}`);
    await expect(page.getByTestId("lane-result-0")).toHaveText("150.0 s", { timeout: 30_000 });
    const setAside = page.getByRole("list", { name: "Penalties set aside by an officer, Tam Ossory" });
    await expect(setAside).toContainText("−100 points · Contact with a person at launch");
    await expect(setAside).toContainText(/set aside by Ines Varga at \d{2}:\d{2}.*: The model passed above the helper/);
    await expect(page.getByRole("list", { name: "Corrections" })).toContainText("Set aside by Ines Varga on the contest's round page");
  } finally {
    await db.end();
  }
});
