import { expect, test } from "@playwright/test";
import { signInAs } from "./support/auth";

test("the app shell reloads from the service worker with no network", async ({ page, context }) => {
  await signInAs(page, "ada@example.com");
  // Wait until the service worker controls the page and has precached everything.
  await page.evaluate(async () => {
    const reg = await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) {
      await new Promise((resolve) => navigator.serviceWorker.addEventListener("controllerchange", resolve, { once: true }));
    }
    return reg.active?.state;
  });
  await page.reload(); // a controlled load puts the home page in the runtime cache
  await expect(page.getByRole("heading", { name: /^Hello,/ })).toBeVisible();

  await context.setOffline(true);
  await page.reload().catch(() => null); // resolves to null offline although the worker answered
  await expect(page.getByRole("heading", { name: /^Hello,/ })).toBeVisible();
  // Earlier specs may have added newer sessions for this account, so any listed field will do.
  await expect(page.getByRole("list", { name: "Recent sessions" }).getByRole("listitem").first()).toBeVisible();
  const workerStart = await page.evaluate(
    () => (performance.getEntriesByType("navigation")[0] as PerformanceNavigationTiming).workerStart,
  );
  expect(workerStart).toBeGreaterThan(0);

  // A precached page never visited before opens offline too.
  await page.goto("/cautions").catch(() => null);
  await expect(page.getByRole("heading", { name: "Safety cautions" })).toBeVisible();
  // And an unknown page falls back to the offline page.
  await page.goto("/never-visited").catch(() => null);
  await expect(page.getByRole("heading", { name: "No signal" })).toBeVisible();
});
