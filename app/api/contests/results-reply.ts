import "server-only";
import { db } from "@/db";
import { listContestPenalties } from "@/db/queries/contest-penalties";
import { getResultsData } from "@/db/queries/contest-results";
import { contestTimeZone } from "@/db/queries/contests";
import { flightsCsv, penaltiesCsv, resultsCsv } from "@/lib/contests/results-csv";
import { resultsPdf } from "@/lib/contests/results-pdf";
import { contestStandings } from "@/lib/contests/standings";
import { NotFoundError } from "@/lib/errors";

/**
 * The contest's standings as JSON, a PDF, or CSV (results, every flight, every penalty), computed from
 * what is recorded now. The PDF lists every penalty under the table, with who gave it and when for the
 * club's members (`members`), with cause and size only through the public link.
 */
export async function resultsReply(contestId: string, format: "json" | "csv" | "flights-csv" | "penalties-csv" | "pdf", opts: { members: boolean }): Promise<Response> {
  const data = await getResultsData(db, contestId);
  if (!data) throw new NotFoundError();
  const { contest, input } = data;
  const headers = { "cache-control": "no-store" };
  if (format === "json") {
    const { id, name, startsOn, fieldName, dropRule } = contest;
    return Response.json({ contest: { id, name, startsOn, fieldName, dropRule }, standings: contestStandings(input) }, { headers });
  }
  const slug = contest.name.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").toLowerCase() || "contest";
  const penaltyList = async () => {
    const [list, zone] = await Promise.all([listContestPenalties(db, contestId), contestTimeZone(db, contestId)]);
    return { list, zone };
  };
  if (format === "pdf") {
    const { list, zone } = await penaltyList();
    const pdf = resultsPdf(contestStandings(input), { name: contest.name, day: contest.startsOn, field: contest.fieldName }, { list, zone, withWho: opts.members });
    return new Response(pdf as BodyInit, { headers: { ...headers, "content-type": "application/pdf", "content-disposition": `attachment; filename="${slug}-results.pdf"` } });
  }
  const body = format === "csv" ? resultsCsv(contestStandings(input))
    : format === "penalties-csv" ? await penaltyList().then(({ list, zone }) => penaltiesCsv(list, zone)) : flightsCsv(input, data.flights);
  const file = `${slug}-${format === "csv" ? "results" : format === "penalties-csv" ? "penalties" : "flights"}.csv`;
  return new Response(body, { headers: { ...headers, "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${file}"` } });
}
