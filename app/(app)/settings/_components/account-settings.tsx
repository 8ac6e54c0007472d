"use client";

import { useState } from "react";
import { useSessionState } from "@/components/auth/session-state";
import { useSync } from "@/components/sync/sync-provider";
import { Button } from "@/components/ui/button";
import { sendJson } from "@/components/request/json";
import { signOutHere } from "./account-session";
import { ChangePasswordForm } from "./change-password-form";
import { DeleteAccountForm } from "./delete-account-form";
import { EmailSettings } from "./email-settings";

/**
 * The Settings page's account section. The page is precached for the field, so this half is a
 * client component that asks next-auth who is signed in; every change goes to /api/account/*
 * and needs a connection.
 */
export function AccountSettings() {
  const { client } = useSync();
  const { user, status } = useSessionState();
  const [error, setError] = useState<string | null>(null);
  if (status === "loading") return <p className="text-muted">Loading your account…</p>;
  if (!user?.email) return <p className="text-muted">Sign in (with a connection) to manage your account.</p>;

  async function signOutEverywhere() {
    const reply = await sendJson("POST", "/api/account/sign-out-everywhere", {});
    if (!reply.ok) return setError(reply.message ?? "Could not sign out everywhere.");
    await signOutHere("?signedOut=everywhere", client);
  }

  return (
    <div className="space-y-6">
      <p>
        Signed in as <span className="font-bold">{user.name}</span> ({user.email})
      </p>
      <EmailSettings />
      <ChangePasswordForm email={user.email} />
      <div className="space-y-2">
        <h3 className="font-bold">Sign out everywhere</h3>
        <p className="text-muted">Signs this account out on every phone and browser, this one included.</p>
        {/* not "Sign out …": the plain Sign out button keeps a name no other button contains */}
        <Button type="button" variant="secondary" onClick={signOutEverywhere}>
          Sign every device out
        </Button>
        <p role="alert" className="font-semibold text-danger empty:hidden">
          {error}
        </p>
      </div>
      <div className="space-y-2">
        <h3 className="font-bold">Your data</h3>
        <a href="/api/account/export" download className="font-bold underline">
          Download all my data (JSON)
        </a>
      </div>
      <DeleteAccountForm />
    </div>
  );
}
