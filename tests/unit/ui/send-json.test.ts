import { afterEach, describe, expect, it, vi } from "vitest";
import { requestJson, sendJson, UNREACHABLE } from "@/components/request/json";

/** The one client request helper (components/request/json.ts): what each kind of answer becomes. */
describe("sendJson", () => {
  afterEach(() => vi.unstubAllGlobals());
  const answer = (status: number, body?: unknown) =>
    vi.stubGlobal("fetch", vi.fn(async () => new Response(body === undefined ? null : JSON.stringify(body), { status, headers: { "content-type": "application/json" } })));

  it("sends the body as JSON with the method, and answers with the reply's body", async () => {
    answer(201, { club: { slug: "heron-flats" } });
    const reply = await sendJson<{ club: { slug: string } }>("POST", "/api/clubs", { name: "Heron Flats" });
    expect(reply).toEqual({ ok: true, status: 201, data: { club: { slug: "heron-flats" } } });
    const [url, init] = vi.mocked(fetch).mock.calls[0]!;
    expect(url).toBe("/api/clubs");
    expect(init).toMatchObject({ method: "POST", body: '{"name":"Heron Flats"}', headers: { "content-type": "application/json" } });
  });

  it("a write without a body still says JSON (the proxy refuses other writes with 415); a read says nothing; a 204 has no data", async () => {
    answer(204);
    expect(await sendJson("DELETE", "/api/coach-grants/1")).toEqual({ ok: true, status: 204, data: null });
    const init = vi.mocked(fetch).mock.calls[0]![1]!;
    expect(init.body).toBeUndefined();
    expect(init.headers).toEqual({ "content-type": "application/json" });
    answer(200, {});
    await sendJson("GET", "/api/coach-grants");
    expect(vi.mocked(fetch).mock.calls[0]![1]!.headers).toBeUndefined(); // a new stub for the read
  });

  it("a refusal carries the server's code, sentence and field complaints (lib/api.ts shape)", async () => {
    answer(422, { error: { code: "invalid", message: "Check the form.", issues: [{ path: "email", message: "Not an e-mail address." }] } });
    expect(await sendJson("POST", "/api/x", {})).toEqual({
      ok: false, status: 422, code: "invalid", message: "Check the form.", issues: [{ path: "email", message: "Not an e-mail address." }],
    });
  });

  it("a refusal without a JSON body still gets a sentence", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => new Response("<html>bad gateway</html>", { status: 502 })));
    const reply = await sendJson("POST", "/api/x", {});
    expect(reply.ok).toBe(false);
    expect(reply.ok ? "" : reply.message).toBe("Something went wrong. Try again.");
  });

  it("no connection is a refusal with status 0, never a throw", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => { throw new TypeError("Failed to fetch"); }));
    expect(await sendJson("POST", "/api/x", {})).toEqual({ ok: false, status: 0, message: UNREACHABLE });
  });

  it("requestJson throws the server's sentence, for TanStack Query", async () => {
    answer(403, { error: { code: "forbidden", message: "Only the pilot can do that." } });
    await expect(requestJson("GET", "/api/x")).rejects.toThrow("Only the pilot can do that.");
    answer(200, { n: 1 });
    await expect(requestJson("GET", "/api/x")).resolves.toEqual({ n: 1 });
  });
});
