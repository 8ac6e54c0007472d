/**
 * Absolute links for e-mails. The app's public address is APP_URL, or NEXTAUTH_URL (which npm start
 * and the test scripts set to the address they serve on).
 */
export function appLink(path: string, params: Record<string, string> = {}): string {
  const base = process.env.APP_URL ?? process.env.NEXTAUTH_URL ?? "http://localhost:3000";
  const url = new URL(path, base);
  for (const [k, v] of Object.entries(params)) url.searchParams.set(k, v);
  return url.href;
}
