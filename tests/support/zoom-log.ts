/**
 * A 10 Hz altimeter log as CSV ("seconds,altitude_m", seconds from `startMs`, metres): for each
 * flight a 3 s zoom to `heightsM[i]` (a quadratic ease-out) after its launch, a straight glide down
 * to its landing, and 0 m on the ground, until 15 s after the last landing. Shared by the
 * integration and end-to-end tests of the altimeter upload.
 */
export function zoomLogCsv(startMs: number, flights: readonly { launch: number; land: number }[], heightsM: readonly number[]): string {
  const rows = ["seconds,altitude_m"];
  const end = flights[flights.length - 1]!.land + 15_000;
  for (let t = startMs; t <= end; t += 100) {
    const i = flights.findIndex((f) => t >= f.launch && t < f.land);
    const f = flights[i];
    const top = heightsM[i] ?? 0;
    let h = 0;
    if (f) h = t <= f.launch + 3000 ? top * (1 - ((f.launch + 3000 - t) / 3000) ** 2) : top * (1 - (t - f.launch - 3000) / (f.land - f.launch - 3000));
    rows.push(`${((t - startMs) / 1000).toFixed(1)},${h.toFixed(1)}`);
  }
  return `${rows.join("\n")}\n`;
}
