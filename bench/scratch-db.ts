/**
 * Imported first by the profile scripts, which write tens of thousands of rows: they refuse the app's database
 * (`windowcall`) and the integration tests' (`windowcall_test`), where those rows stayed and slowed the tests
 * (fuzz.test went past its limit). Run them as `npm run bench -- bench/<script>.ts [args]`, which gives them the
 * benches' own database (windowcall_bench), migrated and seeded, and drops it afterwards.
 */
export {};
const url = process.env.DATABASE_URL;
const name = url ? decodeURIComponent(new URL(url).pathname.slice(1)) : "";
if (!url || name === "windowcall" || name === "windowcall_test") {
  console.error(`refused: ${url ? `database "${name}" is not for profiles` : "DATABASE_URL is not set"}; run \`npm run bench -- ${process.argv[1]?.replace(/^.*\/bench\//, "bench/") ?? "bench/<script>.ts"}\``);
  process.exit(2);
}
