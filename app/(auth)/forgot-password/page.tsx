import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "./forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password" };

export default async function ForgotPasswordPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const email = (await searchParams).email;
  return (
    <>
      <h1 className="text-xl font-bold">Forgot your password</h1>
      <p>Type the e-mail address of your account. We will send it a link to choose a new password.</p>
      <ForgotPasswordForm initialEmail={typeof email === "string" ? email.slice(0, 254) : ""} />
      <p>
        <Link href="/sign-in" className="font-bold underline">
          Back to sign in
        </Link>
      </p>
    </>
  );
}
