import { expect, type APIRequestContext } from "@playwright/test";

/**
 * Writes to /api must come from the site's own origin (proxy.ts): a test's direct API calls say
 * so, as the app's own pages do. `baseURL` is the origin the request goes to.
 */
export function sameOrigin(baseURL: string | undefined): Record<string, string> {
  return { origin: new URL(baseURL ?? "http://localhost").origin };
}

/** Creates an account through the API; returns its e-mail. */
export async function signUpByApi(request: APIRequestContext, baseURL: string | undefined, name: string, tag: string, password: string): Promise<string> {
  const email = `${tag}-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@example.com`;
  const made = await request.post("/api/account/sign-up", { headers: sameOrigin(baseURL), data: { name, email, password } });
  expect(made.status()).toBe(201);
  return email;
}
