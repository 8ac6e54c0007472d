import type { ModelRow } from "@/db/queries/models";

export const STATUS_LABEL: Record<ModelRow["status"], string> = {
  flying: "flying",
  "being-repaired": "being repaired",
  retired: "retired",
  sold: "sold",
};
