import { FirstUseCautions } from "./first-use-cautions";
import { AssignedPlans, ContestDuties, OpenWindows, PlanEditor, RecentResults } from "./field-islands";

/**
 * /field: windows still open on this phone, the start control, contest timekeeping duties, practice plans, recent results,
 * the cautions. The shell renders on the server; what is read from the phone's database comes
 * in islands loaded after first paint (field-islands.tsx).
 */
export function FieldHome() {
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-extrabold">Field</h1>
      <FirstUseCautions />
      <OpenWindows />
      <a href="/field/new" className="flex min-h-[5.5rem] items-center justify-center rounded-2xl bg-accent text-2xl font-extrabold text-accent-ink">
        Start a task window
      </a>
      <ContestDuties />
      <AssignedPlans />
      <PlanEditor />
      <section aria-labelledby="recent-title" className="space-y-2">
        <h2 id="recent-title" className="text-lg font-bold">
          Recent results on this phone
        </h2>
        <RecentResults />
      </section>
      <a href="/cautions" className="flex min-h-touch items-center justify-center rounded-xl border-2 border-ink font-bold">
        <span aria-hidden>⚠&nbsp;</span>Safety cautions
      </a>
    </div>
  );
}
