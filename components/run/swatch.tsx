/** The strip's fills as small swatches, so legends and the breakdown use the strip's own marks. */
export type SwatchKind = "air" | "ground" | "pale" | "zero" | "window" | "target" | "capped" | "short";

export function Swatch({ kind }: { kind: SwatchKind }) {
  return (
    <svg viewBox="0 0 16 12" className="inline-block h-3 w-4 align-[-1px]" aria-hidden="true">
      {kind === "target" ? (
        <path d="M 2 1 L 14 1 L 8 11 Z" fill="rgb(var(--ink))" />
      ) : kind === "zero" ? (
        <>
          <rect x="0.5" y="0.5" width="15" height="11" fill="rgb(var(--raised))" stroke="rgb(var(--ink))" />
          <path d="M 0 12 L 12 0 M 6 12 L 16 2 M 0 6 L 6 0" stroke="rgb(var(--ink))" strokeWidth="2" />
        </>
      ) : kind === "window" ? (
        <>
          <rect x="0.5" y="0.5" width="15" height="11" fill="rgb(var(--raised))" stroke="rgb(var(--ink))" strokeDasharray="2 1.5" />
          <path d="M 0 6 L 6 12 M 4 0 L 16 12 M 10 0 L 16 6" stroke="rgb(var(--muted))" strokeWidth="1" />
        </>
      ) : kind === "capped" ? (
        <>
          <rect x="0.5" y="0.5" width="15" height="11" fill="rgb(var(--air))" />
          <line x1="10" x2="10" y1="1" y2="11" stroke="rgb(var(--raised))" strokeWidth="2" />
        </>
      ) : kind === "short" ? (
        <rect x="0.75" y="0.75" width="14.5" height="10.5" fill="none" stroke="rgb(var(--air))" strokeWidth="1.5" strokeDasharray="3 2" />
      ) : (
        <rect
          x="0.5"
          y="0.5"
          width="15"
          height="11"
          fill={kind === "air" ? "rgb(var(--air))" : kind === "pale" ? "rgb(var(--air-pale))" : "rgb(var(--ground))"}
          stroke={kind === "ground" ? "rgb(var(--ink))" : "rgb(var(--air))"}
        />
      )}
    </svg>
  );
}
