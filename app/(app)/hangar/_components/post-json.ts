/** POSTs (or PATCHes) JSON and returns the reply's body, or throws the server's message. */
export async function sendJson<T>(url: string, body: unknown, method = "POST"): Promise<T> {
  const res = await fetch(url, { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  const data = (await res.json().catch(() => ({}))) as T & { error?: { message?: string } };
  if (!res.ok) throw new Error(data.error?.message ?? `The server answered ${res.status}.`);
  return data;
}
