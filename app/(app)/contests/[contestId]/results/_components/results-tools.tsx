"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { sendJson } from "@/app/(app)/clubs/_components/send-json";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";

export function PrintButton({ label = "Print" }: { label?: string }) {
  return <Button type="button" variant="secondary" onClick={() => window.print()}>{label}</Button>;
}

/** The officer's public results link: make one (a new one replaces the old), copy it, or revoke it. */
export function PublicLink({ contestId, token }: { contestId: string; token: string | null }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const url = `/api/contests/${contestId}/public-link`;
  async function act(method: "POST" | "DELETE") {
    const reply = await sendJson(method, url);
    if (reply.ok) { setMessage(null); router.refresh(); } else setMessage(reply.message);
  }
  const href = token ? `/results/${token}` : null;
  return (
    <section aria-labelledby="public-link" className="space-y-2 print:hidden">
      <h2 id="public-link" className="text-lg font-bold">Public link</h2>
      <p className="text-sm">Anyone with the link sees these standings without an account. Making a new link stops the old one.</p>
      {href ? (
        <p className="break-all"><a className="inline-flex min-h-12 items-center underline" href={href}>{href}</a></p>
      ) : <p className="text-muted">No public link.</p>}
      <div className="flex flex-wrap gap-3">
        <Button type="button" onClick={() => void act("POST")}>{href ? "Make a new public link" : "Make a public link"}</Button>
        {href && <Button type="button" variant="danger" onClick={() => void act("DELETE")}>Revoke the public link</Button>}
      </div>
      <FormError message={message} />
    </section>
  );
}
