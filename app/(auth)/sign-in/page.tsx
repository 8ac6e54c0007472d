import type { Metadata } from "next";
import Link from "next/link";
import { Suspense } from "react";
import { SignInForm } from "./_components/sign-in-form";
import { SignInNotice } from "./_components/sign-in-notice";

export const metadata: Metadata = { title: "Sign in" };

export default function SignInPage() {
  return (
    <>
      <h1 className="text-xl font-bold">Sign in</h1>
      <Suspense>
        <SignInNotice />
        <SignInForm />
      </Suspense>
      <p>
        <Link href="/forgot-password" className="underline">
          Forgot your password?
        </Link>
      </p>
      <p>
        New here?{" "}
        <Link href="/sign-up" className="font-bold underline">
          Create an account
        </Link>
      </p>
    </>
  );
}
