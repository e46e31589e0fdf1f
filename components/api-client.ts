/** The browser side of the API: JSON in, JSON out, errors as `ApiFailure` with the server's code and fields. */
export class ApiFailure extends Error {
  constructor(public status: number, public code: string, message: string, public fields?: Record<string, string>, public body?: unknown) {
    super(message);
  }
}

export async function api<T = unknown>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method: init.method ?? (init.body === undefined ? "GET" : "POST"),
      headers: init.body === undefined ? undefined : { "content-type": "application/json" },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    });
  } catch {
    throw new ApiFailure(0, "offline", "Cannot reach the server. Check the connection; nothing was lost on this page.");
  }
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const e = data?.error ?? {};
    throw new ApiFailure(res.status, e.code ?? "error", e.message ?? `Request failed (${res.status})`, e.fields, data);
  }
  return data as T;
}
