/** The model's mass after each repair, as a small line (oldest left); nothing with fewer than two points. */
export function MassOverTime({ points }: { points: { date: string; massG: number }[] }) {
  const sorted = [...points].sort((a, b) => a.date.localeCompare(b.date));
  if (sorted.length < 2) return null;
  const min = Math.min(...sorted.map((p) => p.massG)) - 5;
  const max = Math.max(...sorted.map((p) => p.massG)) + 5;
  const x = (i: number) => 10 + (i * 280) / (sorted.length - 1);
  const y = (g: number) => 70 - ((g - min) * 60) / (max - min);
  const label = `Mass over time: ${sorted.map((p) => `${p.date} ${p.massG} g`).join(", ")}`;
  return (
    <figure className="space-y-1">
      <svg viewBox="0 0 300 80" role="img" aria-label={label} className="w-full text-accent">
        <polyline fill="none" stroke="currentColor" strokeWidth="3" points={sorted.map((p, i) => `${x(i)},${y(p.massG)}`).join(" ")} />
        {sorted.map((p, i) => <circle key={p.date + i} cx={x(i)} cy={y(p.massG)} r="4" fill="currentColor" />)}
      </svg>
      <figcaption className="text-sm text-muted">Mass after repairs: {sorted[0]!.massG} g → {sorted[sorted.length - 1]!.massG} g</figcaption>
    </figure>
  );
}
