import type { Metadata } from "next";
import { ConfirmLink } from "../_components/confirm-link";

export const metadata: Metadata = { title: "Confirm your new e-mail address" };

export default async function ConfirmEmailPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const token = (await searchParams).token;
  return (
    <>
      <h1 className="text-xl font-bold">Confirm your new e-mail address</h1>
      <ConfirmLink
        token={typeof token === "string" ? token : ""}
        url="/api/account/email/confirm"
        action="Confirm my new address"
        done="Your account now uses this address. Sign in with it from now on."
      />
    </>
  );
}
