"use client";
import { useState } from "react";
import { useSend } from "@/components/request/use-send";
import { Button } from "@/components/ui/button";

type Drawn = { pilots: string[]; tiedAtCutOff: string[] };

/**
 * The officer's "Draw the fly-off": the server takes the top pilots of the preliminary order and
 * refuses while a preliminary round is not scored. When fly-off results exist it refuses too, and
 * this offers drawing again with a confirmation (those results are deleted).
 */
export function DrawFlyOff({ contestId, drawn }: { contestId: string; drawn: boolean }) {
  const { send, busy, error } = useSend();
  const [replace, setReplace] = useState(false);
  const [done, setDone] = useState<Drawn | null>(null);
  async function draw(replaceResults: boolean) {
    const reply = await send<Drawn>("POST", `/api/contests/${contestId}/draw/fly-off`, { replaceResults },
      replaceResults ? { confirm: "Draw the fly-off again and delete the fly-off results entered so far?" } : {});
    if (!reply) return;
    setReplace(!reply.ok && reply.code === "has_results");
    if (reply.ok) setDone(reply.data);
  }
  return (
    <div className="space-y-2">
      <Button type="button" disabled={busy} onClick={() => void draw(false)}>{drawn ? "Draw the fly-off again" : "Draw the fly-off"}</Button>
      {error && <p role="alert" className="text-danger">{error}</p>}
      {replace && <Button type="button" variant="danger" disabled={busy} onClick={() => void draw(true)}>Draw again and delete the fly-off results</Button>}
      {done && done.tiedAtCutOff.length > 0 && (
        <p role="status">Tied at the cut-off, all of them fly: {done.tiedAtCutOff.join(", ")}.</p>
      )}
    </div>
  );
}
