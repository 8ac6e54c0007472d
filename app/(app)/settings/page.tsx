import type { Metadata } from "next";
import Link from "next/link";
import { ThemePicker } from "./_components/theme-picker";
import { SignOutButton } from "./_components/sign-out-button";
import { CalloutSettingsForm } from "./_components/callout-settings";
import { AccountSettings } from "./_components/account-settings";
import { SettingsSection } from "./_components/settings-section";
import { CoachAccess } from "./_components/coach-access";
import { QueryProvider } from "@/components/query/query-provider";

export const metadata: Metadata = { title: "Settings" };

/** Settings live on the device (theme, callouts) so they work offline. */
export default function SettingsPage() {
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">Settings</h1>
      <SettingsSection id="theme" title="Screen">
        <ThemePicker />
      </SettingsSection>
      <SettingsSection id="callouts" title="Callouts">
        <CalloutSettingsForm />
      </SettingsSection>
      <section className="space-y-2">
        <Link href="/cautions" className="font-bold underline">
          Safety cautions
        </Link>
      </section>
      <SettingsSection id="coaches" title="Coaches">
        <QueryProvider>
          <CoachAccess />
        </QueryProvider>
        <Link href="/coach" className="font-bold underline">
          Coach desk: pilots who let you see their season, or enter a pilot&apos;s code
        </Link>
      </SettingsSection>
      <SettingsSection id="account" title="Account">
        <AccountSettings />
      </SettingsSection>
      <SignOutButton />
    </div>
  );
}
