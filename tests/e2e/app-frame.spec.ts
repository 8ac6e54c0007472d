import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

test.use({ viewport: { width: 360, height: 740 }, serviceWorkers: "block" });

test("on a 360 px phone every bottom-bar screen is a thumb-sized target, and the gear in the top bar opens Settings", async ({ page }) => {
  await signInAs(page, "ada@example.com");
  const links = page.getByRole("navigation", { name: "Main" }).getByRole("link");
  await expect(links).toHaveText(["Home", "Field", "Logbook", "Hangar", "Clubs", "Season"]);
  for (const link of await links.all()) {
    const box = await link.boundingBox();
    // 48 px: the usual minimum touch target (WCAG 2.2 2.5.8 asks 24; platform guides ask 44–48)
    expect(box?.width).toBeGreaterThanOrEqual(48);
    expect(box?.height).toBeGreaterThanOrEqual(48);
  }
  // no label is cut or runs into its neighbour: each fits inside its own link
  for (const link of await links.all()) {
    const fits = await link.evaluate((a) => [...a.querySelectorAll("span")].every((s) => s.scrollWidth <= a.clientWidth));
    expect(fits).toBe(true);
  }
  await page.getByRole("banner").getByRole("link", { name: "Settings" }).click();
  await expect(page).toHaveURL(/\/settings$/);
  await expect(page.getByRole("region", { name: "Account" })).toContainText("ada@example.com");
});
