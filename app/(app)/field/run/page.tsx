export default function RunPage() {
  return <h1 className="text-2xl font-extrabold">Task window</h1>;
}
