import type { Metadata } from "next";
import Link from "next/link";
import { ThemePicker } from "./_components/theme-picker";
import { SignOutButton } from "./_components/sign-out-button";
import { CalloutSettingsForm } from "./_components/callout-settings";
import { AccountSettings } from "./_components/account-settings";

export const metadata: Metadata = { title: "Settings" };

/** Settings live on the device (theme, callouts) so they work offline. */
export default function SettingsPage() {
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">Settings</h1>
      <section aria-labelledby="theme-h" className="space-y-2">
        <h2 id="theme-h" className="text-lg font-bold">
          Screen
        </h2>
        <ThemePicker />
      </section>
      <section aria-labelledby="callouts-h" className="space-y-2">
        <h2 id="callouts-h" className="text-lg font-bold">
          Callouts
        </h2>
        <CalloutSettingsForm />
      </section>
      <section className="space-y-2">
        <Link href="/cautions" className="font-bold underline">
          Safety cautions
        </Link>
      </section>
      <section aria-labelledby="account-h" className="space-y-2">
        <h2 id="account-h" className="text-lg font-bold">
          Account
        </h2>
        <AccountSettings />
      </section>
      <SignOutButton />
    </div>
  );
}
