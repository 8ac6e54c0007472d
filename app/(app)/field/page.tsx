import type { Metadata } from "next";
import { FieldHome } from "@/components/field/field-home";

export const metadata: Metadata = { title: "Field" };

/** Static shell (precached for offline use); everything shown is read from this phone's database. */
export default function FieldPage() {
  return <FieldHome />;
}
