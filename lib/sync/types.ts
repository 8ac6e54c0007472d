/** The derivation's types live with the one result function (lib/results/types.ts). */
export type * from "@/lib/results/types";
