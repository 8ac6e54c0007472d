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

/**
 * Headers on every response, assets and the service worker included. The per-request ones (the
 * nonce-based Content-Security-Policy, HSTS over HTTPS) are set in proxy.ts.
 * Permissions: the field timer keeps the screen awake and may read the position of a new field;
 * nothing else it does needs a permission (vibration is not one).
 */
const securityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "X-Frame-Options", value: "DENY" },
  {
    key: "Permissions-Policy",
    value: "camera=(), microphone=(), geolocation=(self), screen-wake-lock=(self), payment=(), usb=(), display-capture=()",
  },
];

/** @type {import("next").NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  typedRoutes: false,
  async headers() {
    return [{ source: "/:path*", headers: securityHeaders }];
  },
};

export default withSerwist(nextConfig);
