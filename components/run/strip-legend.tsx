import { Swatch, type SwatchKind } from "./swatch";

/** What the strip's marks mean, in words beside the marks themselves. */
export function StripLegend({ landing }: { landing: boolean }) {
  const items: [SwatchKind, string][] = [
    ["air", "in the air"],
    ["ground", "on the ground"],
    ["capped", "cut at the cap"],
    ["pale", "not counted"],
    ["zero", "scores zero"],
    ["target", "target"],
  ];
  if (landing) items.push(["window", "landing window"]);
  // The scale below the strip counts minutes from the start.
  return (
    <ul className="flex flex-wrap gap-x-3 gap-y-1 text-xs text-muted" aria-hidden="true">
      {items.map(([kind, text]) => (
        <li key={kind} className="whitespace-nowrap">
          <Swatch kind={kind} /> {text}
        </li>
      ))}
      <li className="whitespace-nowrap">scale: minutes</li>
    </ul>
  );
}
