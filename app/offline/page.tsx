import type { Metadata } from "next";
import Link from "next/link";

export const metadata: Metadata = { title: "Offline" };

/** Shown when a page was never visited online and there is no signal now. */
export default function OfflinePage() {
  return (
    <main className="mx-auto max-w-sm space-y-4 px-5 py-10">
      <h1 className="text-2xl font-extrabold">No signal</h1>
      <p>This page has not been saved on this phone yet. The field timer and your saved runs still work offline.</p>
      <p className="flex flex-col gap-3">
        <a href="/field" className="font-bold underline">
          Open the field timer
        </a>
        <Link href="/" className="underline">
          Try the home page again
        </Link>
      </p>
    </main>
  );
}
