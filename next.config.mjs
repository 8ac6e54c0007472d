import withSerwistInit from "@serwist/next";
import { execSync } from "node:child_process";
import { randomUUID } from "node:crypto";

// One revision per build for the routes precached by hand (the plugin revisions its own assets).
const revision = (() => {
  try {
    return execSync("git rev-parse HEAD", { stdio: ["ignore", "pipe", "ignore"] }).toString().trim() + "-" + Date.now();
  } catch {
    return randomUUID();
  }
})();

/** Pages the field needs with no signal, precached at install (tests/e2e/offline.spec.ts checks them). */
const offlineRoutes = ["/offline", "/settings", "/cautions", "/field", "/field/new", "/field/run", "/logbook", "/logbook/run"];

const withSerwist = withSerwistInit({
  swSrc: "worker/sw.ts",
  swDest: "public/sw.js",
  additionalPrecacheEntries: offlineRoutes.map((url) => ({ url, revision })),
  reloadOnOnline: false,
  disable: process.env.NODE_ENV === "development" && !process.env.WINDOWCALL_SW_DEV,
});

/** @type {import("next").NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  typedRoutes: false,
};

export default withSerwist(nextConfig);
