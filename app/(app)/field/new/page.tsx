export default function NewWindowPage() {
  return <h1 className="text-2xl font-extrabold">New task window</h1>;
}
