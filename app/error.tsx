"use client";

/** Last-resort error screen for the root segment. */
export default function RootError({ reset }: { error: Error; reset: () => void }) {
  return (
    <main className="mx-auto max-w-sm space-y-4 px-5 py-10">
      <h1 className="text-2xl font-extrabold">Something went wrong</h1>
      <p>Nothing you recorded on this phone is lost: it is stored on the device.</p>
      <button onClick={reset} className="min-h-touch rounded-xl border-2 border-ink px-5 font-bold">
        Try again
      </button>
    </main>
  );
}
