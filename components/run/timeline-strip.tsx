import { clockText, creditedTargetText, STATUS_MARK, secondsText } from "@/lib/field/display";
import { formatTenths, type LiveFlight, type TaskDefinition } from "@/lib/tasks";
import { StripLegend } from "./strip-legend";
import { stripLayout, type StripSegment } from "./strip-layout";

type Props = {
  definition: TaskDefinition;
  /** The lane's flights (LaneScore.flights or LaneLive.flights). */
  flights: readonly LiveFlight[];
  /** Live screens: ms since the start, to draw the flight in the air up to now. */
  nowMs?: number | null;
  /** Names the strip for screen readers, e.g. the pilot. */
  label: string;
  /** Launch heights from an altimeter log, by flight index (m): drawn as a label at each flight's start. */
  launchHeights?: ReadonlyMap<number, number>;
};

// Drawn in units close to CSS pixels on a phone (≈ 360 px wide), so text and ticks stay legible.
const W = 360;
const TOP = 12; // room for target ticks
const H = 36; // strip height
const SCALE_Y = TOP + H + 3;

const fillOf = (s: StripSegment) =>
  s.status === "invalid" ? "url(#strip-hatch)" : s.status === "not-counted" ? "rgb(var(--air-pale))" : "rgb(var(--air))";

/**
 * The working time as one horizontal strip: each flight a filled block (air), the ground
 * the gaps between, targets as ticks above, the landing window hatched after the end, a
 * minute scale below. Status is drawn by shape too (hatched = scores zero, pale = not
 * counted, a notch at a capped flight's cap), and the whole is repeated as text.
 */
export function TimelineStrip({ definition, flights, nowMs = null, label, launchHeights }: Props) {
  const layout = stripLayout(definition, flights, nowMs);
  const span = Math.max(1, layout.toMs - layout.fromMs);
  const x = (ms: number) => ((ms - layout.fromMs) / span) * W;
  const captionId = `strip-${label.replace(/\W+/g, "-")}`;
  return (
    <figure className="space-y-1">
      <svg viewBox={`-6 0 ${W + 12} ${SCALE_Y + 18}`} className="block h-auto w-full" role="img" aria-labelledby={captionId} data-testid="timeline-strip">
        <defs>
          <pattern id="strip-hatch" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="8" height="8" fill="rgb(var(--raised))" />
            <line x1="0" y1="0" x2="0" y2="8" stroke="rgb(var(--ink))" strokeWidth="3" />
          </pattern>
          <pattern id="strip-window" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(-45)">
            <line x1="0" y1="0" x2="0" y2="6" stroke="rgb(var(--muted))" strokeWidth="1.5" />
          </pattern>
        </defs>
        {layout.working.map((b) => (
          <rect key={b.fromMs} x={x(b.fromMs)} y={TOP} width={x(b.toMs) - x(b.fromMs)} height={H} fill="rgb(var(--ground))" stroke="rgb(var(--ink))" strokeWidth="2" />
        ))}
        {layout.landing.map((b) => (
          <rect key={`lw${b.fromMs}`} x={x(b.fromMs)} y={TOP} width={x(b.toMs) - x(b.fromMs)} height={H} fill="url(#strip-window)" stroke="rgb(var(--ink))" strokeWidth="1" strokeDasharray="4 3" />
        ))}
        {layout.segments.map((s) => (
          <rect
            key={s.flight}
            data-flight={s.flight + 1}
            data-status={s.status}
            x={x(s.fromMs)}
            y={TOP + 3}
            width={Math.max(2, x(s.toMs) - x(s.fromMs))}
            height={H - 6}
            fill={fillOf(s)}
            stroke="rgb(var(--air))"
            strokeWidth="1.5"
            strokeDasharray={s.status === "open" ? "5 3" : undefined}
          />
        ))}
        {layout.segments.map((s) => {
          const cap = s.status === "capped" ? capSecOf(definition, flights.find((f) => f.index === s.flight)) : null;
          if (cap === null) return null;
          const at = x(s.fromMs + cap * 1000);
          return <line key={`cap${s.flight}`} x1={at} x2={at} y1={TOP + 3} y2={TOP + H - 3} stroke="rgb(var(--raised))" strokeWidth="3" />;
        })}
        {layout.segments.map((s) => {
          const f = flights.find((g) => g.index === s.flight);
          const credited = f && definition.kind === "window" && definition.ladder && (f.status === "counted" || f.status === "capped") ? f.targetSec : null;
          if (credited === null || credited === undefined || x(s.toMs) - x(s.fromMs) < 30) return null;
          return (
            <text key={`c${s.flight}`} x={x(s.fromMs) + 3} y={TOP + H / 2 + 4} fontSize="11" fontWeight="700" fill="rgb(var(--raised))" className="figures" data-credited={credited}>
              {clockText(credited)}
            </text>
          );
        })}
        {layout.segments.map((s) => {
          const height = launchHeights?.get(s.flight);
          if (height === undefined) return null;
          return (
            <text key={`h${s.flight}`} x={x(s.fromMs) + 2} y={TOP + H - 6} fontSize="10" fontWeight="700" fill="rgb(var(--ink))" className="figures" data-launch-height={height}>
              {`${Math.round(height)} m`}
            </text>
          );
        })}
        {layout.ticks.map((t) => (
          <path key={`t${t.flight}`} d={`M ${x(t.atMs) - 5} 1 L ${x(t.atMs) + 5} 1 L ${x(t.atMs)} ${TOP + 4} Z`} stroke="rgb(var(--raised))" strokeWidth="1" fill="rgb(var(--ink))" data-target={t.targetSec} />
        ))}
        {layout.scale.map((m) => (
          <g key={`m${m.atMs}`}>
            <line x1={x(m.atMs)} x2={x(m.atMs)} y1={TOP + H} y2={SCALE_Y + 3} stroke="rgb(var(--ink))" strokeWidth="1.5" />
            <text x={x(m.atMs)} y={SCALE_Y + 16} fontSize="12" fontWeight="600" textAnchor={m.label.endsWith("min") || m.label.startsWith("#") ? "start" : "middle"} fill="rgb(var(--ink))" className="figures">
              {m.label}
            </text>
          </g>
        ))}
      </svg>
      <figcaption id={captionId} className="sr-only">
        {`${label}: working time as a strip. `}
        {describeStrip(definition, flights, nowMs)}
        {launchHeights?.size ? ` Launch heights: ${[...launchHeights].map(([i, h]) => `flight ${i + 1} ${Math.round(h)} m`).join(", ")}.` : ""}
      </figcaption>
      <StripLegend landing={layout.landing.length > 0} />
    </figure>
  );
}

/** The strip in words: each flight with its time and status, and the ground time before it. */
export function describeStrip(definition: TaskDefinition, flights: readonly LiveFlight[], nowMs: number | null = null): string {
  const layout = stripLayout(definition, flights, nowMs);
  if (layout.segments.length === 0) return "No flights.";
  const groundBefore = new Map(layout.gaps.map((g) => [g.beforeFlight, g.tenths]));
  return layout.segments
    .map((s) => {
      const ground = groundBefore.get(s.flight);
      const f = flights.find((g) => g.index === s.flight);
      const target = f ? creditedTargetText(f) : null;
      return [
        ground !== undefined ? `${secondsText(ground)} s on the ground, then` : null,
        `flight ${s.flight + 1} from ${formatTenths(Math.trunc(s.fromMs / 100))} for ${secondsText(s.airTenths)} s,`,
        STATUS_MARK[s.status].label + (target ? `, ${target}` : "") + ".",
      ]
        .filter(Boolean)
        .join(" ");
    })
    .join(" ");
}

/** The cap or target a capped flight was cut at, in seconds. */
function capSecOf(def: TaskDefinition, f: LiveFlight | undefined): number | null {
  if (!f) return null;
  return f.targetSec ?? (def.kind === "window" || def.kind === "all-up" ? def.capSec : null);
}
