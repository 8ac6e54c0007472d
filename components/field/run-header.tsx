import { describeTask } from "@/lib/field/describe-task";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import type { TaskDefinition } from "@/lib/tasks";

/** Which task, for whom, where: small and quiet above the figures. */
export function RunHeader({ task, run, session }: { task: TaskDefinition; run: RunEntity; session: SessionEntity | undefined }) {
  const who = run.lanes.map((l) => l.pilotName).join(", ");
  return (
    <header>
      <h1 className="truncate text-base font-extrabold">
        {task.letter ? `Task ${task.letter} · ` : ""}
        {task.name}
      </h1>
      <p className="truncate text-sm text-muted">
        {who}
        {session ? ` · ${session.fieldName}` : ""} · {describeTask(task)}
      </p>
    </header>
  );
}
