import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import Papa from "papaparse";
import { sameOrigin } from "./support/api";
import { signInAs } from "./support/auth";

/**
 * Contest results (issue 15), with the seeded demo club (Ines is Heronmoor's officer, Ada a member).
 * The officer enters round 1 (task A, last flight, 300 s cap, F3K.11.1) from paper cards; the
 * standings equal a computation made here from the cards alone (RULES.md: normalised per group,
 * best = 1000, F3K.9.1; unsigned = 0, F3K.1.2; penalties subtracted, F3K.10); the public link shows
 * them to a browser that is signed out, until revoked.
 */

const PILOTS = ["Alma Rook", "Bram Tilley", "Cora Vantle", "Dane Orrick", "Esme Pell", "Fitz Amory", "Gale Morrow", "Hale Penn", "Iris Cobb", "Jory Vale"];
/** Each card: two flights in tenths; Esme's last is over the cap; Cora has a 100-point penalty; Hale's card is unsigned. */
const CARDS = new Map(PILOTS.map((name, i) => [name, { flights: [700 + i * 10, name === "Esme Pell" ? 3205 : 1500 + i * 137], penalty: name === "Cora Vantle" ? 100 : 0, signed: name !== "Hale Penn" }]));
const typed = (tenths: number[]) => tenths.map((t) => (t / 10).toFixed(1)).join(" ");

async function noSeriousAxe(page: Page) {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
  expect(bad.map((v) => `${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);
}

/** The totals shown, by pilot: the row header's name, the last cell's points. */
async function shownTotals(page: Page, names: string[]): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  const table = page.getByRole("table", { name: "Standings" });
  for (const name of names) {
    const row = table.getByRole("row").filter({ has: page.getByRole("rowheader", { name }) });
    out[name] = (await row.getByRole("cell").last().innerText()).trim();
  }
  return out;
}

test("the officer enters a round from paper cards; the standings equal a computation from the cards, and the public link shows them signed out", async ({ page, browser, baseURL }) => {
  test.setTimeout(120_000);
  await signInAs(page, "ines@example.com");
  const headers = sameOrigin(baseURL);
  const made = await page.request.post("/api/clubs/heronmoor/contests", { headers, data: {
    name: `Reed Cup ${Date.now()}`, startsOn: "2027-05-08", fieldName: "Five Acre Meadow", rounds: ["A", "B", "D", "F", "H"].map((letter) => ({ letter })),
    maxGroupSize: 5, prepMinutes: 5, noFlySeconds: 60, dropRule: "f3k", practice: false,
  } });
  expect(made.status()).toBe(201);
  const contestId = ((await made.json()) as { contest: { id: string } }).contest.id;
  for (const pilotName of PILOTS) expect((await page.request.post(`/api/contests/${contestId}/paper-entries`, { headers, data: { pilotName } })).status()).toBe(201);
  expect((await page.request.post(`/api/contests/${contestId}/draw`, { headers, data: {} })).status()).toBe(201);

  await page.goto(`/contests/${contestId}`);
  await page.getByRole("link", { name: "Paper cards for round 1" }).click();
  await expect(page.getByRole("heading", { name: "Round 1: paper cards" })).toBeVisible();

  // The groups as drawn, read from the forms; each card typed in, the engine's check seen as we type.
  const groups: string[][] = [];
  for (const g of [1, 2]) {
    const form = page.getByRole("form", { name: `Group ${g}` });
    const names = (await form.locator("legend").allInnerTexts()).map((n) => n.trim());
    expect(names).toHaveLength(5);
    groups.push(names);
    for (const name of names) {
      const card = CARDS.get(name)!;
      await form.getByLabel(`Flight times of ${name}`).fill(typed(card.flights));
      if (card.penalty) await form.getByLabel(`Penalty points of ${name}`).fill(String(card.penalty));
      if (card.signed) await form.getByLabel(`Signed (${name})`).check();
    }
    if (names.includes("Esme Pell")) await expect(form.getByText("320.5 s: counts, capped")).toBeVisible();
    await form.getByLabel(`Flight times of ${names[0]}`).fill(`${typed(CARDS.get(names[0]!)!.flights)} 9x`);
    await expect(form.getByText('"9x" is not a flight time.')).toBeVisible();
    await form.getByLabel(`Flight times of ${names[0]}`).fill(typed(CARDS.get(names[0]!)!.flights));
    await form.getByRole("button", { name: `Save group ${g}` }).click();
    await expect(form.getByText(`Group ${g} saved.`)).toBeVisible();
  }
  await noSeriousAxe(page);

  // Independent computation from the cards: task A counts the last flight, at most 300.0 s; unsigned → 0;
  // points = result / best of the group × 1000 to 0.1 (half up, in integers); total = points − penalty.
  const expected: Record<string, string> = {};
  for (const names of groups) {
    const result = (n: string) => (CARDS.get(n)!.signed ? Math.min(CARDS.get(n)!.flights.at(-1)!, 3000) : 0);
    const best = Math.max(...names.map(result));
    for (const n of names) {
      const tenths = Math.floor((2 * result(n) * 10_000 + best) / (2 * best)); // round half up
      expected[n] = ((tenths - CARDS.get(n)!.penalty * 10) / 10).toFixed(1);
    }
  }

  await page.getByRole("link", { name: "Results" }).first().click();
  await expect(page.getByRole("heading", { name: /^Results:/ })).toBeVisible();
  expect(await shownTotals(page, PILOTS)).toEqual(expected);
  await expect(page.getByRole("table", { name: "Standings" }).getByText("unsigned")).toHaveCount(1);
  await noSeriousAxe(page);

  await page.getByRole("button", { name: "Make a public link" }).click();
  const link = page.getByRole("link", { name: /^\/results\// });
  await expect(link).toBeVisible();
  const href = (await link.getAttribute("href"))!;

  const stranger = await (await browser.newContext()).newPage();
  await stranger.goto(href);
  await expect(stranger.getByRole("heading", { name: /^Reed Cup/ })).toBeVisible();
  expect(await shownTotals(stranger, PILOTS)).toEqual(expected);
  await noSeriousAxe(stranger);

  await page.getByRole("button", { name: "Revoke the public link" }).click();
  await expect(page.getByText("No public link.")).toBeVisible();
  expect((await stranger.goto(href))?.status()).toBe(404);
});

test("a member reads the demo contest's standings, teams and printable sheets", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  await page.getByRole("list", { name: "Coming contests" }).getByRole("link", { name: "Heronmoor Winter Cup" }).click();
  await page.getByRole("link", { name: "Results", exact: true }).click();
  const table = page.getByRole("table", { name: "Standings" });
  await expect(table.getByRole("row")).toHaveCount(1 + 12);
  await expect(table.getByRole("columnheader", { name: "R3 D" })).toBeVisible();
  await expect(page.getByRole("list", { name: "Teams" })).toContainText("Marsh Larks");
  // the seeded juniors, ranked among themselves with their overall place beside
  const juniors = page.getByRole("list", { name: "Juniors" }).getByRole("listitem");
  await expect(juniors).toHaveCount(2);
  await expect(juniors.filter({ hasText: "Finn Brackley" })).toContainText("overall");
  await expect(juniors.filter({ hasText: "Gus Wendle" })).toContainText(/^[12]\. Gus Wendle/);
  await expect(page.getByRole("button", { name: "Make a public link" })).toHaveCount(0);
  // the seeded paper card's 100-point penalty in round 2, with who entered it and when; round 3's two officer's penalties, one removed;
  // and round 3's phone penalty (Mara's phone) that Ines set aside (db/seed/demo-phone-set-aside.ts)
  await page.getByText(/^Penalties \(4\)/).click();
  await expect(page.getByRole("list", { name: "Penalties" })).toContainText(/^Round 2, .+: −100; on the paper card, entered by Ines Varga \d/);
  await expect(page.getByRole("list", { name: "Penalties" })).toContainText("Round 3, Dov Ashgrove: −100, Launched or flew outside the group's times (F3K.9.5) \"Launched before the working-time signal\"; given on the round page by Ines Varga");
  await expect(page.getByRole("list", { name: "Penalties" })).toContainText("removed by Ines Varga");
  await expect(page.getByRole("list", { name: "Penalties" })).toContainText(/Round 3, Hana Roskell: −100, .+; given on the timekeeper's phone by Mara Lindqvist .+; set aside by Ines Varga .+: Hana launched on the signal/);
  await noSeriousAxe(page);
  const csv = await page.request.get(`${page.url().replace("/contests/", "/api/contests/")}?format=csv`);
  const csvText = await csv.text();
  expect(csvText.split("\r\n")[0]).toBe("Place,Pilot,Team,Round 1 (A),Round 2 (B),Round 3 (D),Penalties,Total,Note,Re-flights");
  // the seeded re-flight of round 2 (F3K.9.6): both results and which counted; the seeded open dispute of round 3 in the note
  const rows = Papa.parse<Record<string, string>>(csvText, { header: true, skipEmptyLines: true }).data;
  const bea = rows.find((r) => r.Pilot === "Bea Quillfeather")!;
  expect(bea["Re-flights"]).toMatch(/^round 2: original \d+\.\d s, re-flight \d+\.\d s: (re-flight|original) counted$/);
  expect(rows.find((r) => r.Pilot === "Cass Merriden")!.Note).toContain("round 3 result under dispute");
  // every penalty, one a row, with cause, who and when (the club's clock) and a removal's who and why; each looked up
  // with its round: the seed's round-2 card penalty goes to whichever pilot the draw put second (entry ids are random)
  const pens = Papa.parse<Record<string, string>>(await (await page.request.get(`${page.url().replace("/contests/", "/api/contests/")}?format=penalties-csv`)).text(), { header: true, skipEmptyLines: true }).data;
  expect(pens).toHaveLength(4);
  expect(pens.find((r) => r.Pilot === "Hana Roskell" && r.Round === "3")).toMatchObject({ Round: "3", Points: "100", "Given by": "Mara Lindqvist", Counts: "no: set aside", "Removed by": "Ines Varga" });
  expect(pens.find((r) => r.Pilot === "Dov Ashgrove" && r.Round === "3")).toMatchObject({ Round: "3", Points: "100", Cause: "Launched or flew outside the group's times (F3K.9.5)", "Given by": "Ines Varga", Counts: "yes" });
  expect(pens.find((r) => r.Pilot === "Elin Tarrow" && r.Round === "3")).toMatchObject({ Points: "300", Counts: "no: removed", "Removed by": "Ines Varga", "Why removed": "The person was Elin's own helper, not a bystander" });
  expect(pens.find((r) => r.Pilot === "Dov Ashgrove" && r.Round === "3")!["Given at"]).toMatch(/\d{2}:\d{2}/);
  const pdf = await page.request.get(`${page.url().replace("/contests/", "/api/contests/")}?format=pdf`);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");
  const pdfText = (await pdf.body()).toString("latin1");
  expect(pdfText.startsWith("%PDF-")).toBe(true);
  // jsPDF writes text uncompressed: the same line as the CSV's, in the re-flights list under the table
  expect(pdfText).toContain(`(Bea Quillfeather, ${bea["Re-flights"]})`);

  await page.getByRole("link", { name: "Group lists and scoresheets" }).click();
  await expect(page.getByRole("region", { name: "Scoresheet round 1 group 1" }).getByRole("columnheader", { name: "Timekeeper's signature" })).toBeVisible();
  await expect(page.getByRole("region", { name: /^Scoresheet/ })).toHaveCount(10);
  await noSeriousAxe(page);
});
