import type { Metadata } from "next";
import { NewWindowForm } from "@/components/field/new-window-form";

export const metadata: Metadata = { title: "New task window" };

/** Static shell (precached for offline use): the form writes to the device's database. */
export default function NewWindowPage() {
  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-extrabold">New task window</h1>
      <NewWindowForm />
    </div>
  );
}
