"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { useSync } from "@/components/sync/sync-provider";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { deleteAccountSchema, type DeleteAccountInput } from "@/lib/validations/account";
import { sendJson } from "@/components/request/json";
import { fieldErrors, signOutHere } from "./account-session";

/**
 * Deletes the account after its password is typed again (react-hook-form with the zod resolver:
 * the message beside the field; an empty password sends nothing); says plainly what is kept for others.
 */
export function DeleteAccountForm() {
  const { client } = useSync();
  const { register, handleSubmit, setError, formState } = useForm<DeleteAccountInput>({ resolver: zodResolver(deleteAccountSchema), defaultValues: { password: "" } });

  async function onValid(data: DeleteAccountInput) {
    const reply = await sendJson("DELETE", "/api/account", data);
    if (!reply.ok) return setError("password", { message: fieldErrors<"password">(reply.issues ?? []).password ?? reply.message });
    await signOutHere("?deleted=1", client);
  }

  return (
    <form onSubmit={(e) => void handleSubmit(onValid)(e)} className="space-y-3" noValidate aria-labelledby="delete-h">
      <h3 id="delete-h" className="font-bold">
        Delete my account
      </h3>
      <p className="text-muted">
        Your sessions, runs and coach grants are removed. Results in other pilots&apos; runs stay in their logbooks under the
        name &quot;Deleted pilot&quot;. This cannot be undone; download your data first if you want a copy.
      </p>
      <TextField id="delete-password" type="password" label="Your password, to confirm" autoComplete="current-password" required {...register("password")} error={formState.errors.password?.message} />
      <Button type="submit" variant="danger" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Deleting…" : "Delete my account"}
      </Button>
    </form>
  );
}
