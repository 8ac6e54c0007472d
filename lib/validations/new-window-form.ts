import { z } from "zod";

/**
 * The new-window form as typed (numbers still text), checked field by field in plain words
 * beside each field (react-hook-form's zod resolver). lib/field/new-window.ts then turns the
 * values into the session and run, and the task engine checks the task as a whole.
 */
const numberText = (min: number, max: number, message: string, whole = false) =>
  z.string().refine((s) => {
    const t = s.trim().replace(",", ".");
    if (t === "") return true;
    const n = Number(t);
    return Number.isFinite(n) && n >= min && n <= max && (!whole || Number.isInteger(n));
  }, message);

const required = (check: z.ZodString, message: string) => z.string().refine((s) => s.trim() !== "", message).pipe(check);

export const customTaskFormSchema = z
  .object({
    name: z.string().trim().min(1, "Give the task a name.").max(80, "Keep the name under 80 characters."),
    workingMin: required(numberText(0.5, 60, "Working time is a number of minutes from 0.5 to 60."), "Give the working time in minutes (from 0.5 to 60)."),
    targets: z.string().refine((s) => {
      const parts = s.split(/[\s,;]+/).filter(Boolean);
      return parts.length <= 12 && parts.every((p) => /^\d+$/.test(p) && Number(p) >= 1 && Number(p) <= 3600);
    }, "Targets are whole seconds from 1 to 3600, separated by spaces (at most 12)."),
    order: z.enum(["in-order", "any-order"]),
    capSec: numberText(1, 3600, "The cap is a whole number of seconds from 1 to 3600, or empty for none.", true),
    counting: z.enum(["all", "best", "last"]),
    count: z.string(),
    launchLimit: numberText(1, 50, "The launch limit is a whole number from 1 to 50, or empty for unlimited.", true),
  })
  .superRefine((d, ctx) => {
    const ladder = d.targets.trim() !== "";
    if (ladder || d.counting === "all") return;
    const t = d.count.trim();
    const n = Number(t);
    if (t === "" || !Number.isInteger(n) || n < 1 || n > 20) ctx.addIssue({ code: "custom", path: ["count"], message: "Say how many flights count: a whole number from 1 to 20." });
  });
export type CustomTaskForm = z.infer<typeof customTaskFormSchema>;

/** The custom task's shape alone: checked by customTaskFormSchema only when the custom task is chosen. */
const customTaskShape = z.object({
  name: z.string(),
  workingMin: z.string(),
  targets: z.string(),
  order: z.enum(["in-order", "any-order"]),
  capSec: z.string(),
  counting: z.enum(["all", "best", "last"]),
  count: z.string(),
  launchLimit: z.string(),
});

export const newWindowFormSchema = z
  .object({
    fieldName: z.string().trim().min(1, "Name the field (e.g. the meadow you fly at).").max(120, "Keep the field name under 120 characters."),
    windMs: numberText(0, 60, "Wind is a number of m/s from 0 to 60."),
    gustMs: numberText(0, 80, "Gusts are a number of m/s from 0 to 80."),
    temperatureC: numberText(-50, 60, "Temperature is a number of °C from −50 to 60."),
    notes: z.string().max(2000, "Keep the notes under 2000 characters."),
    taskKey: z.string().min(1, "Choose a task."),
    custom: customTaskShape,
    prepMin: numberText(0, 60, "Preparation is a number of minutes from 0 to 60."),
    noFly: z.boolean(),
  })
  .superRefine((v, ctx) => {
    if (v.taskKey !== "custom") return;
    const custom = customTaskFormSchema.safeParse(v.custom);
    if (!custom.success) for (const issue of custom.error.issues) ctx.addIssue({ code: "custom", path: ["custom", ...issue.path], message: issue.message });
  });
export type NewWindowForm = z.infer<typeof newWindowFormSchema>;
