import type { Metadata } from "next";
import { Suspense } from "react";
import { RunReview } from "./_components/run-review";

export const metadata: Metadata = { title: "Run" };

/** Static shell (precached for offline use); the run is read from the phone's database by its ?id=. */
export default function LogbookRunPage() {
  return (
    <Suspense fallback={<p aria-busy="true">Reading the run…</p>}>
      <RunReview />
    </Suspense>
  );
}
