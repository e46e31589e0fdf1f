/**
 * The browser side of the API, the one place that reads an answer: JSON (or a multipart upload) in,
 * JSON out, every refusal as an `ApiFailure` with the server's code, message, fields and whole body.
 */
export class ApiFailure extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public fields?: Record<string, string>,
    /** The whole answer: `{error: {code, message, fields?, …}}` (a 409 carries the current revision, an import its report). */
    public body?: unknown,
  ) {
    super(message);
  }
  /** No answer at all: the connection is down (nothing reached the server). */
  get offline() {
    return this.status === 0;
  }
  /** A key the server put beside code and message (`current`, `report`, `hazards`, …). */
  detail<T = unknown>(key: string): T | undefined {
    return (this.body as { error?: Record<string, unknown> } | null)?.error?.[key] as T | undefined;
  }
}

async function send<T>(url: string, init: RequestInit, offline: string): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, init);
  } catch {
    throw new ApiFailure(0, "offline", offline);
  }
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const e = data?.error ?? {};
    throw new ApiFailure(res.status, e.code ?? "error", e.message ?? `The server answered ${res.status}.`, e.fields, data);
  }
  return data as T;
}

/** A JSON request: POST when there is a body, GET otherwise, unless `method` says. */
export function api<T = unknown>(url: string, init: { method?: string; body?: unknown; headers?: Record<string, string> } = {}): Promise<T> {
  const hasBody = init.body !== undefined;
  return send<T>(
    url,
    {
      method: init.method ?? (hasBody ? "POST" : "GET"),
      headers: hasBody || init.headers ? { ...(hasBody ? { "content-type": "application/json" } : {}), ...init.headers } : undefined,
      body: hasBody ? JSON.stringify(init.body) : undefined,
    },
    "Cannot reach the server. Check the connection; nothing was lost on this page.",
  );
}

/** A file upload: multipart POST with the file in the field `file`. */
export function uploadFile<T = unknown>(url: string, file: Blob, name?: string): Promise<T> {
  const form = new FormData();
  form.set("file", file, name ?? (file instanceof File ? file.name : "upload"));
  return send<T>(url, { method: "POST", body: form }, "Cannot reach the server; the file was not uploaded.");
}

export const ACCEPT_PHOTOS = "image/jpeg,image/png,image/webp";
export const ACCEPT_FILES = `${ACCEPT_PHOTOS},application/pdf`;
