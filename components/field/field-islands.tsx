"use client";

import dynamic from "next/dynamic";

/**
 * The parts of /field that read this phone's database: their code (the device database, the
 * result engine, the schemas) loads just after the page is drawn, so the field's first load
 * carries only the shell — the title, the start control and the links. Nothing here renders
 * on the server: the database is in the browser.
 */
export const OpenWindows = dynamic(() => import("./field-runs").then((m) => m.OpenWindows), { ssr: false });

export const RecentResults = dynamic(() => import("./field-runs").then((m) => m.RecentResults), {
  ssr: false,
  loading: () => <p aria-busy="true">Reading this phone&apos;s windows…</p>,
});

export const PlanEditor = dynamic(() => import("./plan-editor").then((m) => m.PlanEditor), {
  ssr: false,
  loading: () => <p aria-busy="true">Reading this phone&apos;s plans…</p>,
});

export const AssignedPlans = dynamic(() => import("./assigned-plans").then((m) => m.AssignedPlans), { ssr: false });

export const ContestDuties = dynamic(() => import("./contest-duties").then((m) => m.ContestDuties), { ssr: false });
