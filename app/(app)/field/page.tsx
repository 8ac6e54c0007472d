export default function FieldPage() {
  return <h1 className="text-2xl font-extrabold">Field</h1>;
}
