export default function LogbookRunPage() {
  return <h1 className="text-2xl font-extrabold">Run</h1>;
}
