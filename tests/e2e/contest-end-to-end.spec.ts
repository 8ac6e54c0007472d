import { expect, test, type Browser, type BrowserContext, type Page } from "@playwright/test";
import pg from "pg";
import { sameOrigin, signUpByApi } from "./support/api";
import { signInAs } from "./support/auth";
import { press, settle, workerReady } from "./support/field";

/**
 * Issue 15's "Done when" run, one small contest end to end, on its own invented club so no demo data moves:
 * a new officer starts the club and sets up 5 rounds with an entry fee; 10 new pilots (accounts made through
 * the sign-up API, `signUpByApi`, and put in the club with one SQL insert, the test-only seed path the
 * contest specs use) enter and pay through the local payments fake — one card is declined and the payment
 * retried; the draw is made; two timekeeper phones (two browser contexts) time round 1's two groups with no
 * signal, pilots sign on the phones, the phones come back and sync; round 3 is typed from paper cards; the
 * totals on the results page and on the public link (signed out) equal a computation made here from the
 * times this test flew and typed (RULES.md: task A F3K.11.1, task D F3K.11.4, normalised per group best =
 * 1000 F3K.9.1, drop from 6 rounds F3K.10.1).
 * The phones run on Playwright's paused clock, so every flight lasts exactly the time the test gives it.
 */
test.describe.configure({ timeout: 360_000 });

const STAMP = Date.now().toString(36);
const CLUB = `Larkmoor Soaring ${STAMP}`;
const PASSWORD = "end-to-end-pw-1";
/** Invented pilots; FLOWN[name] is the one flight each flies in round 1 (task A, ms), TYPED[name] the two flights of round 3's card (task D, tenths). */
const PILOTS = ["Arlo Quill", "Bryn Hollis", "Cass Meridew", "Dov Ashcombe", "Elin Farrow", "Fenn Corrie", "Gwen Tallis", "Hugo Brenlow", "Ivo Sandell", "Juno Pereth"];
const FLOWN = new Map(PILOTS.map((n, i) => [n, [63_400, 71_200, 48_900, 80_500, 55_300, 92_100, 67_800, 59_600, 74_000, 86_700][i]!]));
const TYPED = new Map(PILOTS.map((n, i) => [n, i === 4 ? [1_204, 3_125] : [900 + i * 73, 1_800 - i * 91]])); // Elin's second flight is over the 300 s cap
const KEEPERS = ["Tamsin Ordway", "Piet Vellacott"]; // the two timekeepers, invented

/** Round 1, task A (F3K.11.1): the last flight counts, at most 300.0 s. Tenths. */
const round1Result = (name: string) => Math.min(FLOWN.get(name)! / 100, 3000);
/** Round 3, task D (F3K.11.4): both flights count, each at most 300.0 s. Tenths. */
const round3Result = (name: string) => TYPED.get(name)!.reduce((s, t) => s + Math.min(t, 3000), 0);
/** Points in tenths: result ÷ best of the group × 1000 (F3K.9.1), to 0.1 point, exact halves up (the contest's setting), in integers. */
const points = (result: number, best: number) => Math.floor((2 * result * 10_000 + best) / (2 * best));

/** Totals in tenths: every round's points, the lowest dropped from 6 rounds flown (F3K.10.1; here 2 rounds, so none), no penalties. */
function independentTotals(rounds: { groups: string[][]; result: (name: string) => number }[]): Record<string, string> {
  const perPilot = new Map<string, number[]>(PILOTS.map((n) => [n, []]));
  for (const { groups, result } of rounds) {
    for (const group of groups) {
      const best = Math.max(...group.map(result));
      for (const n of group) perPilot.get(n)!.push(points(result(n), best));
    }
  }
  const out: Record<string, string> = {};
  for (const [n, scores] of perPilot) {
    const sorted = [...scores].sort((a, b) => a - b);
    const counted = scores.length >= 6 ? sorted.slice(1) : sorted;
    out[n] = (counted.reduce((s, p) => s + p, 0) / 10).toFixed(1);
  }
  return out;
}

async function shownTotals(page: Page): Promise<Record<string, string>> {
  const table = page.getByRole("table", { name: "Standings" });
  const out: Record<string, string> = {};
  for (const name of PILOTS) {
    const row = table.getByRole("row").filter({ has: page.getByRole("rowheader", { name }) });
    out[name] = (await row.getByRole("cell").last().innerText()).trim();
  }
  return out;
}

async function signedIn(browser: Browser, contexts: BrowserContext[], email: string, password = PASSWORD): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  contexts.push(context);
  const page = await context.newPage();
  await signInAs(page, email, password);
  return { context, page };
}

/** A pilot enters on the contest page and pays on the fake's page; `declineFirst`: the card is declined once and the payment retried. */
async function enterAndPay(page: Page, contestUrl: string, declineFirst: boolean) {
  await page.goto(contestUrl);
  await page.getByRole("button", { name: "Enter and pay" }).click();
  await expect(page.getByRole("heading", { name: "Test payment" })).toBeVisible();
  const fee = page.getByRole("group", { name: "Your entry fee" });
  if (declineFirst) {
    await page.getByRole("button", { name: "Decline the card" }).click();
    await expect(page.getByRole("alert")).toContainText("Your card was declined");
    await page.getByRole("link", { name: "Back to Windowcall without paying" }).click();
    await expect(fee).toContainText("payment failed.");
    await fee.getByRole("button", { name: "Try the payment again" }).click();
    await expect(page.getByRole("heading", { name: "Test payment" })).toBeVisible();
  }
  await page.getByRole("button", { name: "Pay 8.00 EUR" }).click();
  await expect(fee).toContainText("Entry fee 8.00 EUR: paid by card.");
}

/**
 * One timekeeper's phone at the field: the duties arrived with signal; then no signal, the clock paused
 * (time moves only by runFor), and each duty's window is set up with one tap, flown lane by lane and signed.
 */
async function timeDuties(page: Page, context: BrowserContext, keeper: string, contestName: string, duties: { group: number; pilots: string[] }[]) {
  await page.goto("/field");
  await workerReady(page);
  // the duty names its pilots in the server's order: matched by round and group, then each pilot checked
  const dutyOf = (group: number) => page.getByRole("article", { name: new RegExp(`^Contest: round 1, group ${group} — pilots `) }).filter({ hasText: contestName });
  for (const d of duties) {
    await expect(dutyOf(d.group)).toBeVisible({ timeout: 30_000 });
    const named = ((await dutyOf(d.group).getAttribute("aria-label")) ?? "").replace(/^.* — pilots /, "").split(", ");
    expect(new Set(named)).toEqual(new Set(d.pilots));
  }
  await context.setOffline(true);
  const t0 = new Date();
  await page.clock.install({ time: t0 });
  await page.reload().catch(() => null); // served by the worker; the duties come from the phone's database
  await page.clock.pauseAt(new Date(t0.getTime() + 60_000));
  for (const d of duties) {
    await page.goto("/field").catch(() => null);
    const setUp = dutyOf(d.group).getByRole("button", { name: new RegExp(`^Set up round 1, group ${d.group}: `) });
    await settle(page, setUp, 50);
    await page.clock.runFor(1_000); // the phone's profile and duties load from its database on the paused clock's timers
    await setUp.click();
    for (let spent = 0; !/\/field\/run\?id=/.test(page.url()) && spent < 5_000; spent += 50) await page.clock.runFor(50);
    await expect(page).toHaveURL(/\/field\/run\?id=/);
    const start = page.getByRole("button", { name: "Start working time" });
    await settle(page, start, 50);
    await press(page, start);
    for (const name of d.pilots) {
      const launch = page.getByRole("button", { name: new RegExp(`^Launch, (Lane \\d · )?${name}$`) });
      const landed = page.getByRole("button", { name: new RegExp(`^Landed, (Lane \\d · )?${name}$`) });
      await page.clock.runFor(1_000);
      await press(page, launch);
      await expect(landed).toBeVisible();
      await page.clock.runFor(FLOWN.get(name)!);
      await press(page, landed);
      await expect(launch).toBeVisible();
    }
    await page.getByText("End this window early").click();
    await page.getByRole("button", { name: "Close the window now" }).click();
    await expect(page.getByRole("heading", { name: "Contest: sign the results" })).toBeVisible();
    for (const name of d.pilots) {
      const lane = page.getByRole("listitem", { name: `Signature, ${name}` });
      await lane.getByLabel(`${name}: I agree with this result`).check();
      await lane.getByLabel(`${keeper}: I timed it`).check();
      await lane.getByRole("button", { name: `Sign ${name}'s result` }).click();
      await expect(lane.getByRole("status")).toContainText(`Signed by ${name} and ${keeper} at`);
    }
  }
}

test("a small contest end to end: set-up, paid entries (one retried), the draw, two phones offline, paper cards, results equal to an independent computation, public link", async ({ browser, baseURL }) => {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const contexts: BrowserContext[] = [];
  try {
    // Accounts: the officer, ten pilots, two timekeepers; the officer starts the club, the others join it.
    const api = await browser.newContext();
    contexts.push(api);
    const request = api.request;
    const officerEmail = await signUpByApi(request, baseURL, "Oriel Banfield", "e2e-officer", PASSWORD);
    const pilotEmails = new Map<string, string>();
    for (const name of PILOTS) pilotEmails.set(name, await signUpByApi(request, baseURL, name, "e2e-pilot", PASSWORD));
    const keeperEmails = [] as string[];
    for (const name of KEEPERS) keeperEmails.push(await signUpByApi(request, baseURL, name, "e2e-keeper", PASSWORD));
    const { page: officer } = await signedIn(browser, contexts, officerEmail);
    const club = await officer.request.post("/api/clubs", { headers: sameOrigin(baseURL), data: { name: CLUB } });
    expect(club.status()).toBe(201);
    const slug = ((await club.json()) as { club: { slug: string } }).club.slug;
    await db.query(
      "insert into memberships (club_id, user_id, role) select c.id, u.id, 'member' from clubs c, users u where c.slug = $1 and u.email = any($2)",
      [slug, [...pilotEmails.values(), ...keeperEmails]],
    );

    // Set-up through the form: 5 rounds (the form's A, B, D, F, G: F3K.10), groups of 5, an entry fee.
    const contestName = `Larkmoor Open ${STAMP}`;
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
    await officer.goto(`/contests/new?club=${slug}`);
    await officer.getByLabel("Name").fill(contestName);
    await officer.getByLabel("Date", { exact: true }).fill(tomorrow);
    await officer.getByLabel("Field", { exact: true }).fill("Gorse Hollow");
    await officer.getByLabel("Largest group (pilots)").fill("5");
    await officer.getByLabel("Entry fee (empty: free)").fill("8");
    await officer.getByLabel("Entries close (withdrawals before then are refunded)").fill(`${tomorrow}T07:00`);
    await expect(officer.getByRole("list", { name: "Rule checks" })).toHaveCount(0);
    await officer.getByRole("button", { name: "Create the contest" }).click();
    await expect(officer.getByRole("heading", { name: contestName })).toBeVisible();
    await expect(officer.getByRole("list", { name: "Rounds" }).getByRole("listitem")).toHaveCount(5);
    const contestUrl = officer.url();
    const contestId = contestUrl.split("/contests/")[1]!;

    // Ten pilots enter and pay, five browsers at a time; Cass's card is declined once and she pays on the retry.
    for (const batch of [PILOTS.slice(0, 5), PILOTS.slice(5)]) {
      await Promise.all(batch.map(async (name) => {
        const { page } = await signedIn(browser, contexts, pilotEmails.get(name)!);
        await enterAndPay(page, contestUrl, name === "Cass Meridew");
        await page.context().close();
      }));
    }
    await officer.reload();
    await expect(officer.getByRole("region", { name: "Entry fees" })).toContainText("10 of 10 entries paid · 80.00 EUR taken");
    await expect(officer.getByRole("list", { name: "Entries", exact: true }).getByRole("listitem")).toHaveCount(10);

    // The draw: 2 groups of 5 each round (F3K.9.1).
    await officer.getByRole("button", { name: "Make the draw" }).click();
    await expect(officer.getByText(/^Seed \d+$/)).toBeVisible();
    const groupOf = async (round: number, group: number) =>
      ((await officer.getByRole("region", { name: `Round ${round}` }).locator("p", { hasText: new RegExp(`^Group ${group}:`) }).textContent()) ?? "")
        .replace(/^Group \d+:\s*/, "").split(", ").map((s) => s.trim());
    const round1 = [await groupOf(1, 1), await groupOf(1, 2)];
    for (const g of round1) expect(g).toHaveLength(5);
    expect(new Set(round1.flat())).toEqual(new Set(PILOTS));

    // Round 1's timekeepers: a phone holds four lanes, so each keeper times four pilots of one group and
    // the fifth of the other: both phones time both groups.
    const [tamsin, piet] = KEEPERS as [string, string];
    const duties = new Map<string, { group: number; pilots: string[] }[]>([[tamsin, []], [piet, []]]);
    await officer.goto(`/contests/${contestId}/rounds/1`);
    for (const [i, group] of round1.entries()) {
      const [four, one] = i === 0 ? [tamsin, piet] : [piet, tamsin];
      const section = officer.getByRole("region", { name: `Group ${i + 1} timekeepers` });
      for (const [j, name] of group.entries()) await section.getByLabel(`Timekeeper for ${name}`).selectOption({ label: j < 4 ? four : one });
      await section.getByRole("button", { name: `Save group ${i + 1}'s timekeepers` }).click();
      await expect(section.getByRole("status")).toHaveText("Saved.");
      duties.get(four)!.push({ group: i + 1, pilots: group.slice(0, 4) });
      duties.get(one)!.push({ group: i + 1, pilots: group.slice(4) });
    }

    // The two phones, side by side: sync, no signal, time, sign; then signal again.
    const phones = await Promise.all(KEEPERS.map((k, i) => signedIn(browser, contexts, keeperEmails[i]!)));
    await Promise.all(KEEPERS.map((k, i) => timeDuties(phones[i]!.page, phones[i]!.context, k, contestName, duties.get(k)!)));
    for (const { context } of phones) await context.setOffline(false);
    await expect.poll(async () => {
      for (const { page } of phones) await page.clock.runFor(2_000); // the sync client's timers run on the paused clock
      return (await db.query(
        "select count(*)::int as n from group_slots g join contest_rounds r on r.id = g.round_id where r.contest_id = $1 and r.number = 1 and not r.is_fly_off and g.run_id is not null and g.signed_at is not null",
        [contestId],
      )).rows[0].n;
    }, { timeout: 90_000 }).toBe(10);

    // Round 3 from paper cards, all signed.
    await officer.goto(`/contests/${contestId}/rounds/3/cards`);
    await expect(officer.getByRole("heading", { name: "Round 3: paper cards" })).toBeVisible();
    const round3: string[][] = [];
    for (const g of [1, 2]) {
      const form = officer.getByRole("form", { name: `Group ${g}` });
      const names = (await form.locator("legend").allInnerTexts()).map((n) => n.trim());
      expect(names).toHaveLength(5);
      round3.push(names);
      for (const name of names) {
        await form.getByLabel(`Flight times of ${name}`).fill(TYPED.get(name)!.map((t) => (t / 10).toFixed(1)).join(" "));
        await form.getByLabel(`Signed (${name})`).check();
      }
      await form.getByRole("button", { name: `Save group ${g}` }).click();
      await expect(form.getByText(`Group ${g} saved.`)).toBeVisible();
    }
    expect(new Set(round3.flat())).toEqual(new Set(PILOTS));

    // The results, computed here from what the test flew and typed, equal the page's and the public link's.
    const expected = independentTotals([{ groups: round1, result: round1Result }, { groups: round3, result: round3Result }]);
    await officer.goto(`/contests/${contestId}/results`);
    await expect(officer.getByRole("table", { name: "Standings" })).toBeVisible();
    expect(await shownTotals(officer)).toEqual(expected);
    await officer.getByRole("button", { name: "Make a public link" }).click();
    const link = officer.getByRole("link", { name: /^\/results\// });
    await expect(link).toBeVisible();
    const href = (await link.getAttribute("href"))!;
    const stranger = await browser.newContext();
    contexts.push(stranger);
    const signedOut = await stranger.newPage();
    await signedOut.goto(href);
    await expect(signedOut.getByRole("heading", { name: new RegExp(`^${contestName}`) })).toBeVisible();
    expect(await shownTotals(signedOut)).toEqual(expected);
  } finally {
    for (const c of contexts) await c.close().catch(() => null);
    await db.end();
  }
});
