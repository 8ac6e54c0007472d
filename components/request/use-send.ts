"use client";

import { useRouter } from "next/navigation";
import { useCallback, useState } from "react";
import { sendJson, type Reply } from "./json";

type Method = Parameters<typeof sendJson>[0];
type Options = {
  /** Asked before sending (a change that cannot be taken back here); a "no" sends nothing. */
  confirm?: string;
  /** Where to go when it worked; otherwise the page's server parts are read again (router.refresh). */
  then?: string;
  /** false: leave the page as it is on success (the caller shows the outcome itself). */
  refresh?: boolean;
  /** The caller leaves the page on success (to another site): busy stays true, so a second tap sends nothing. */
  leaving?: boolean;
};

/**
 * Send one change, then show it: the pattern of every form and button that writes through a route
 * handler and lets the server render the result. While a request runs `busy` is true; a refusal
 * (or no connection) leaves its sentence (the fields' complaints, if any) in `error` for the control to show beside itself; success
 * refreshes the page (or goes to `then`). The reply is returned for callers that need its body.
 */
export function useSend() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const send = useCallback(
    async <T = unknown>(method: Method, url: string, body?: unknown, options: Options = {}): Promise<Reply<T> | null> => {
      if (options.confirm && !window.confirm(options.confirm)) return null;
      setBusy(true);
      setError(null);
      const reply = await sendJson<T>(method, url, body);
      if (!reply.ok || !options.leaving) setBusy(false);
      if (!reply.ok) {
        setError(reply.issues?.map((i) => i.message).join(" ") || reply.message);
        return reply;
      }
      if (options.then) router.push(options.then);
      if (options.refresh !== false) router.refresh();
      return reply;
    },
    [router],
  );

  return { send, busy, error, setError };
}
