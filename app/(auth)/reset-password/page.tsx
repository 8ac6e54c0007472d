import type { Metadata } from "next";
import { ResetPasswordForm } from "./reset-password-form";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const token = (await searchParams).token;
  return (
    <>
      <h1 className="text-xl font-bold">Choose a new password</h1>
      <ResetPasswordForm token={typeof token === "string" ? token : ""} />
    </>
  );
}
