import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-sm space-y-4 px-5 py-10">
      <h1 className="text-2xl font-extrabold">Not found</h1>
      <p>There is nothing here, or you may not see it.</p>
      <Link href="/" className="font-bold underline">
        Back to the start
      </Link>
    </main>
  );
}
