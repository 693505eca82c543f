// Browser-side JSON fetch for SWR and forms: API errors become ClientApiError
// with the server's message and field errors.
export class ClientApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly code: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = "ClientApiError";
  }
}

export async function fetchJson<T = unknown>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, {
    ...init,
    headers: {
      accept: "application/json",
      ...(init?.body ? { "content-type": "application/json" } : {}),
      ...init?.headers,
    },
  });
  const text = await res.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    throw new ClientApiError(
      `The server answered ${res.status} with something that is not JSON.`,
      res.status,
      "bad_response",
    );
  }
  if (!res.ok) {
    const e = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } })
      ?.error;
    throw new ClientApiError(
      e?.message ?? `Request failed (${res.status}).`,
      res.status,
      e?.code ?? "error",
      e?.fields,
    );
  }
  return body as T;
}
