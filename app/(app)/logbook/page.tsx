export default function LogbookPage() {
  return <h1 className="text-2xl font-extrabold">Logbook</h1>;
}
