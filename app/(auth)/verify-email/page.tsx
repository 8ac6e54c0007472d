import type { Metadata } from "next";
import { ConfirmLink } from "../_components/confirm-link";

export const metadata: Metadata = { title: "Confirm your e-mail address" };

export default async function VerifyEmailPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const token = (await searchParams).token;
  return (
    <>
      <h1 className="text-xl font-bold">Confirm your e-mail address</h1>
      <ConfirmLink
        token={typeof token === "string" ? token : ""}
        url="/api/account/verify-email"
        action="Confirm my e-mail address"
        done="Thank you: your e-mail address is confirmed."
      />
    </>
  );
}
