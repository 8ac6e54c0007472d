"use client";

/** Keeps the app frame when a screen fails. */
export default function AppError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="space-y-4">
      <h1 className="text-xl font-bold">This screen failed to load</h1>
      <p>Your timed flights are stored on this phone and are safe.</p>
      <button onClick={reset} className="min-h-touch rounded-xl border-2 border-ink px-5 font-bold">
        Try again
      </button>
    </div>
  );
}
