"use client";

import { useSend } from "@/components/request/use-send";
import { InlineError } from "@/components/ui/form-footer";

type Props = {
  url: string;
  method: "DELETE" | "PATCH" | "POST";
  body?: unknown;
  label: string;
  /** Asked before sending (a removal cannot be taken back here). */
  confirm?: string;
  /** Where to go when it worked; otherwise the page is read again. */
  then?: string;
  className?: string;
};

/** One button that sends one request; the server's refusal is shown beside it. */
export function ActionButton({ url, method, body, label, confirm, then, className = "" }: Props) {
  const { send, busy, error } = useSend();
  const act = () => void send(method, url, body, { confirm, then });

  return (
    <span className="inline-flex flex-col gap-1">
      <button type="button" onClick={act} disabled={busy} className={`min-h-12 rounded-lg border-2 border-ink px-3 font-bold disabled:opacity-50 ${className}`}>
        {busy ? "Working…" : label}
      </button>
      <InlineError message={error} />
    </span>
  );
}
