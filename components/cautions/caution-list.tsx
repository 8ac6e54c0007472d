/**
 * Safety cautions where people launch and fly (paraphrased from the F3K rules, RULES.md
 * "Cautions to show"). Shown, never enforced: the field's own rules and the country's law come first.
 */
export const CAUTIONS = [
  { title: "Clear launch direction", body: "Keep at least 30 m clear of people in the direction you launch (F3K.3.2). Look before every throw." },
  { title: "Never touch anyone", body: "A launched or flying model must never touch a person (F3K.4.1). Call your landings." },
  { title: "Safety areas", body: "Respect the marked safety areas: no landing, no touching anything inside them (F3K.4.3)." },
  { title: "Airspace", body: "Stay out of forbidden airspace and leave it at once if you drift in (F3K.4.4). Know the local height limits." },
  { title: "Other groups' time", body: "Do not fly during another group's windows or the no-fly minute before a working time (F3K.9.4)." },
  { title: "Ballast and parts", body: "Ballast must be fixed inside the model (F3K.2.6). Check the wingtip peg and joiners before the day." },
  { title: "Wind", body: "Contests pause above 8 m/s wind measured at 2 m height (F3K.5). Practise well within what you can handle." },
] as const;

/** The caution panel: a short list, with the field's rules and the law above everything here. */
export function CautionList() {
  return (
    <div className="space-y-3">
      <ul className="space-y-3">
        {CAUTIONS.map((c) => (
          <li key={c.title} className="card rounded-xl border border-line bg-raised p-3">
            <p className="font-bold">⚠ {c.title}</p>
            <p>{c.body}</p>
          </li>
        ))}
      </ul>
      <p className="font-semibold">
        These notes do not replace the rules of your field, your club or your country&apos;s aviation law — follow those first.
      </p>
    </div>
  );
}
