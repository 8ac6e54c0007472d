import type { Metadata } from "next";
import { LogbookList } from "./_components/logbook-list";

export const metadata: Metadata = { title: "Logbook" };

/** Static shell (precached for offline use); the sessions are read from the phone's own database. */
export default function LogbookPage() {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">Logbook</h1>
      <LogbookList />
    </div>
  );
}
