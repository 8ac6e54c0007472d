"use client";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";

/**
 * The officer's "Make the draw" / "Draw again". The server refuses (409 `has_results`) while the preliminary rounds
 * hold results, naming how many; this then asks with those words and, on "yes", draws again with
 * `replaceResults: true` (those results are deleted with the old draw). "No" sends nothing more.
 */
export function DrawButton({ contestId, label }: { contestId: string; label: string }) {
  const { send, busy, error, setError } = useSend();
  async function draw() {
    const url = `/api/contests/${contestId}/draw`;
    const reply = await send("POST", url, {});
    if (!reply || reply.ok || reply.code !== "has_results") return;
    if (!window.confirm(reply.message)) { setError("Nothing was drawn: the results entered so far are kept."); return; }
    await send("POST", url, { replaceResults: true });
  }
  return (
    <span className="inline-block space-y-1">
      <Button type="button" disabled={busy} onClick={() => void draw()}>{label}</Button>
      {error && <span role="alert" className="block text-danger">{error}</span>}
    </span>
  );
}
