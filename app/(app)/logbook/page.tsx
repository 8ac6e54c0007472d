import type { Metadata } from "next";
import { Suspense } from "react";
import { LogbookList } from "./_components/logbook-list";

export const metadata: Metadata = { title: "Logbook" };

/** Static shell (precached for offline use); the sessions are read from the phone's own database, filtered by the address. */
export default function LogbookPage() {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">Logbook</h1>
      <Suspense fallback={<p aria-busy="true">Reading this phone’s logbook…</p>}>
        <LogbookList />
      </Suspense>
    </div>
  );
}
