/** The error an API call throws on a non-2xx answer: the status and the body's error object. */
export class FetchError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

async function handle<T>(res: Response): Promise<T> {
  const body = await res.json().catch(() => null);
  if (!res.ok) {
    const e = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
    throw new FetchError(res.status, e?.code ?? "server_error", e?.message ?? `Request failed (${res.status}).`, e?.fields);
  }
  return body as T;
}

export function fetcher<T>(url: string): Promise<T> {
  return fetch(url, { headers: { accept: "application/json" } }).then((r) => handle<T>(r));
}

export function sendJson<T>(url: string, method: "POST" | "PUT" | "PATCH" | "DELETE", body?: unknown): Promise<T> {
  return fetch(url, {
    method,
    headers: { "content-type": "application/json", accept: "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  }).then((r) => handle<T>(r));
}
