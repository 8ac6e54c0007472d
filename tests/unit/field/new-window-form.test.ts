import { describe, expect, it } from "vitest";
import { EMPTY_CUSTOM } from "@/components/field/custom-task-fields";
import { newWindowFormSchema } from "@/lib/validations/new-window-form";

const base = { fieldName: "North Meadow", windMs: "", gustMs: "", temperatureC: "", notes: "", taskKey: "custom", custom: EMPTY_CUSTOM, prepMin: "", noFly: false };
const messages = (values: object) => {
  const r = newWindowFormSchema.safeParse({ ...base, ...values });
  return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]));
};

describe("the new-window form's checks (issue #10: plain words beside each field, not schema messages)", () => {
  it("accepts the default custom task and a catalogue task", () => {
    expect(messages({})).toEqual({});
    expect(messages({ taskKey: "H:600", custom: { ...EMPTY_CUSTOM, workingMin: "" } })).toEqual({}); // custom fields not checked when unused
  });
  it("names each wrong custom field in plain words", () => {
    const m = messages({ custom: { ...EMPTY_CUSTOM, workingMin: "0", count: "", capSec: "2.5", launchLimit: "many", targets: "" } });
    expect(m).toEqual({
      "custom.workingMin": "Working time is a number of minutes from 0.5 to 60.",
      "custom.capSec": "The cap is a whole number of seconds from 1 to 3600, or empty for none.",
      "custom.launchLimit": "The launch limit is a whole number from 1 to 50, or empty for unlimited.",
      "custom.count": "Say how many flights count: a whole number from 1 to 20.",
    });
  });
  it("asks for a missing working time and reads bad targets", () => {
    expect(messages({ custom: { ...EMPTY_CUSTOM, workingMin: " " } })["custom.workingMin"]).toBe("Give the working time in minutes (from 0.5 to 60).");
    expect(messages({ custom: { ...EMPTY_CUSTOM, targets: "60 ninety" } })["custom.targets"]).toMatch(/^Targets are whole seconds/);
    expect(messages({ custom: { ...EMPTY_CUSTOM, targets: "60 90", count: "" } })).toEqual({}); // a ladder counts its steps
  });
  it("checks the window's own fields", () => {
    expect(messages({ fieldName: "  ", windMs: "fast", prepMin: "90" })).toEqual({
      fieldName: "Name the field (e.g. the meadow you fly at).",
      windMs: "Wind is a number of m/s from 0 to 60.",
      prepMin: "Preparation is a number of minutes from 0 to 60.",
    });
  });
});
