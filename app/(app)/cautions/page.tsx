import type { Metadata } from "next";
import { CautionList } from "@/components/cautions/caution-list";

export const metadata: Metadata = { title: "Safety cautions" };

export default function CautionsPage() {
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">Safety cautions</h1>
      <CautionList />
    </div>
  );
}
