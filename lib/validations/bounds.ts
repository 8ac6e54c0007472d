/** The shared bounds live with the sync contract (lib/events/bounds.ts); re-exported for forms and routes. */
export * from "@/lib/events/bounds";
