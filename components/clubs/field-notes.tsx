export type FieldNotes = {
  name: string;
  latitude: number | null;
  longitude: number | null;
  launchDirection: string | null;
  safetyAreas: string | null;
  localRules: string | null;
};

/** A club field's own notes as cautions (launch direction, safety areas, local rules), each marked by a sign and a title. */
export function FieldNoteList({ field }: { field: FieldNotes }) {
  const notes = [
    { title: "Launch direction", body: field.launchDirection },
    { title: "Safety areas", body: field.safetyAreas },
    { title: "Local rules", body: field.localRules },
  ].filter((n): n is { title: string; body: string } => !!n.body);
  if (notes.length === 0) return <p className="text-muted">No notes for this field yet.</p>;
  return (
    <ul className="space-y-2">
      {notes.map((n) => (
        <li key={n.title} className="rounded-lg border-2 border-ink p-3">
          <p className="font-bold">⚠ {n.title}</p>
          <p className="whitespace-pre-line">{n.body}</p>
        </li>
      ))}
    </ul>
  );
}

/** Where the field is, in figures, when the club gave its position. */
export function FieldPosition({ field }: { field: FieldNotes }) {
  if (field.latitude === null || field.longitude === null) return null;
  return (
    <p className="figures text-sm text-muted">
      {field.latitude.toFixed(5)}, {field.longitude.toFixed(5)}
    </p>
  );
}
