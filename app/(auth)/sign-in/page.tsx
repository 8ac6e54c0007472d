import type { Metadata } from "next";
import Link from "next/link";
import { Suspense } from "react";
import { SignInForm } from "./_components/sign-in-form";
import { SignInNotice } from "./_components/sign-in-notice";

export const metadata: Metadata = { title: "Sign in" };

/** The links do not prefetch: that fetched and decoded both pages while this one loads (issue #10). */
export default function SignInPage() {
  return (
    <>
      <h1 className="text-xl font-bold">Sign in</h1>
      <Suspense>
        <SignInNotice />
        <SignInForm />
      </Suspense>
      <p>
        <Link href="/forgot-password" prefetch={false} className="underline">
          Forgot your password?
        </Link>
      </p>
      <p>
        New here?{" "}
        <Link href="/sign-up" prefetch={false} className="font-bold underline">
          Create an account
        </Link>
      </p>
    </>
  );
}
