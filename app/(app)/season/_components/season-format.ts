/** Tenths of a second as "160.0 s" (or "—"). */
export const secondsText = (tenths: number | null | undefined): string => (tenths === null || tenths === undefined ? "—" : `${(tenths / 10).toFixed(1)} s`);

/** A share of the task's maximum as "89 %" (or "—"). */
export const shareText = (share: number | null | undefined): string => (share === null || share === undefined ? "—" : `${Math.round(share * 100)} %`);

/** "Task H", or "Custom task". */
export const taskText = (task: string): string => (task === "custom" ? "Custom task" : `Task ${task}`);

const dayFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
const monthFormat = new Intl.DateTimeFormat("en-GB", { month: "long", year: "numeric", timeZone: "UTC" });

/** A "YYYY-MM-DD" day or an ISO instant as "7 Mar 2026" (UTC, as the season's weeks and months are). */
export const dayText = (day: string): string => dayFormat.format(new Date(day.length === 10 ? `${day}T00:00:00Z` : day));

/** A month's first day as "March 2026". */
export const monthText = (day: string): string => monthFormat.format(new Date(`${day}T00:00:00Z`));

/** A week's Monday as "week of 2 Mar". */
export const weekText = (day: string): string => `week of ${dayText(day)}`;

/** Metres as "42.5 m" (or "—"). */
export const metresText = (m: number | null | undefined): string => (m === null || m === undefined ? "—" : `${m.toFixed(1)} m`);
