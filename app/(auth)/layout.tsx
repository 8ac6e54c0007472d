import type { ReactNode } from "react";

/** Sign-in and sign-up: a narrow, centred column. */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh max-w-sm flex-col justify-center gap-6 px-5 py-10">
      <p className="text-3xl font-extrabold tracking-tight">Windowcall</p>
      {children}
    </main>
  );
}
