"use client";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/form-footer";

export function PrintButton({ label = "Print" }: { label?: string }) {
  return <Button type="button" variant="secondary" onClick={() => window.print()}>{label}</Button>;
}

/** The officer's public results link: make one (a new one replaces the old), copy it, or revoke it. */
export function PublicLink({ contestId, token }: { contestId: string; token: string | null }) {
  const { send, busy, error } = useSend();
  const act = (method: "POST" | "DELETE") => void send(method, `/api/contests/${contestId}/public-link`);
  const href = token ? `/results/${token}` : null;
  return (
    <section aria-labelledby="public-link" className="space-y-2 print:hidden">
      <h2 id="public-link" className="text-lg font-bold">Public link</h2>
      <p className="text-sm">Anyone with the link sees these standings without an account. Making a new link stops the old one.</p>
      {href ? (
        <p className="break-all"><a className="inline-flex min-h-12 items-center underline" href={href}>{href}</a></p>
      ) : <p className="text-muted">No public link.</p>}
      <div className="flex flex-wrap gap-3">
        <Button type="button" disabled={busy} onClick={() => act("POST")}>{href ? "Make a new public link" : "Make a public link"}</Button>
        {href && <Button type="button" variant="danger" disabled={busy} onClick={() => act("DELETE")}>Revoke the public link</Button>}
      </div>
      <FormError message={error} />
    </section>
  );
}
