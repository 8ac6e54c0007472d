import type { Metadata } from "next";
import { Suspense } from "react";
import { RunScreen } from "@/components/field/run-screen";

export const metadata: Metadata = { title: "Task window" };

/** Static shell (precached for offline use); the run is read on the device by its ?id=. */
export default function RunPage() {
  return (
    <Suspense fallback={<p aria-busy="true">Opening the window…</p>}>
      <RunScreen />
    </Suspense>
  );
}
