import type { Metadata } from "next";
import Link from "next/link";
import { SignUpForm } from "./_components/sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default function SignUpPage() {
  return (
    <>
      <h1 className="text-xl font-bold">Create an account</h1>
      <SignUpForm />
      <p>
        Have an account?{" "}
        <Link href="/sign-in" className="font-bold underline">
          Sign in
        </Link>
      </p>
    </>
  );
}
