import "server-only";
import { db } from "@/db";
import { getResultsData } from "@/db/queries/contest-results";
import { flightsCsv, resultsCsv } from "@/lib/contests/results-csv";
import { resultsPdf } from "@/lib/contests/results-pdf";
import { contestStandings } from "@/lib/contests/standings";
import { NotFoundError } from "@/lib/errors";

/** The contest's standings as JSON, a PDF, or CSV (results or every flight), computed from what is recorded now. */
export async function resultsReply(contestId: string, format: "json" | "csv" | "flights-csv" | "pdf"): Promise<Response> {
  const data = await getResultsData(db, contestId);
  if (!data) throw new NotFoundError();
  const { contest, input } = data;
  const headers = { "cache-control": "no-store" };
  if (format === "json") {
    const { id, name, startsOn, fieldName, dropRule } = contest;
    return Response.json({ contest: { id, name, startsOn, fieldName, dropRule }, standings: contestStandings(input) }, { headers });
  }
  const slug = contest.name.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").toLowerCase() || "contest";
  if (format === "pdf") {
    const pdf = resultsPdf(contestStandings(input), { name: contest.name, day: contest.startsOn, field: contest.fieldName });
    return new Response(pdf as BodyInit, { headers: { ...headers, "content-type": "application/pdf", "content-disposition": `attachment; filename="${slug}-results.pdf"` } });
  }
  const body = format === "csv" ? resultsCsv(contestStandings(input)) : flightsCsv(input, data.flights);
  const file = `${slug}-${format === "csv" ? "results" : "flights"}.csv`;
  return new Response(body, { headers: { ...headers, "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${file}"` } });
}
