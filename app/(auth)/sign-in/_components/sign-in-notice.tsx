"use client";

import { useSearchParams } from "next/navigation";

/** Why the pilot is on the sign-in page, after an account change that signed them out (settings). */
const NOTICES: Record<string, Record<string, string>> = {
  deleted: { "1": "Your account was deleted." },
  signedOut: { everywhere: "You were signed out on every device." },
  changed: { password: "Your password was changed. Sign in with the new one." },
};

/** The one plain message the query names, or nothing (the page is also precached: read on the client). */
export function SignInNotice() {
  const params = useSearchParams();
  const message = Object.entries(NOTICES)
    .map(([key, values]) => values[params.get(key) ?? ""])
    .find(Boolean);
  if (!message) return null;
  return (
    <p role="status" className="rounded-lg border-2 border-line bg-raised p-3 font-semibold">
      {message}
    </p>
  );
}
