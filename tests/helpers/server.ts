// Talks to the production server that scripts/test.sh started (TEST_BASE_URL).
// Sign-in goes through next-auth's own endpoints, exactly as a browser does.

import { testBaseUrl } from "./ports";

export const BASE_URL = testBaseUrl();

export class Session {
  private cookies = new Map<string, string>();

  constructor(readonly base = BASE_URL) {}

  private remember(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair.indexOf("=");
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1));
    }
  }

  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set("cookie", this.cookieHeader());
    // As a browser does on every non-GET request from our own pages.
    if (!headers.has("origin") && (init.method ?? "GET").toUpperCase() !== "GET")
      headers.set("origin", this.base);
    const res = await fetch(this.base + path, { ...init, headers, redirect: "manual" });
    this.remember(res);
    return res;
  }

  async json<T = unknown>(
    path: string,
    init: Omit<RequestInit, "body"> & { body?: unknown } = {},
  ): Promise<{ status: number; body: T }> {
    const body =
      init.body === undefined || typeof init.body === "string" ? init.body : JSON.stringify(init.body);
    const res = await this.fetch(path, {
      ...init,
      body: body as BodyInit | undefined,
      headers: { "content-type": "application/json", ...(init.headers as Record<string, string>) },
    });
    const text = await res.text();
    return { status: res.status, body: (text ? JSON.parse(text) : null) as T };
  }

  /** Signs in; returns the next-auth error text or null on success. */
  async signIn(email: string, password: string): Promise<string | null> {
    const csrf = await this.json<{ csrfToken: string }>("/api/auth/csrf");
    const form = new URLSearchParams({ csrfToken: csrf.body.csrfToken, email, password, json: "true" });
    const res = await this.fetch("/api/auth/callback/credentials", {
      method: "POST",
      body: form,
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
    const { url } = (await res.json()) as { url: string };
    const error = new URL(url).searchParams.get("error");
    return error ? decodeURIComponent(error) : null;
  }

  async user(): Promise<{ id: number; role: string; email: string } | null> {
    const s = await this.json<{ user?: { id: number; role: string; email: string } }>("/api/auth/session");
    return s.body?.user ?? null;
  }
}

export async function signedIn(email: string, password: string): Promise<Session> {
  const s = new Session();
  const err = await s.signIn(email, password);
  if (err) throw new Error(`sign-in as ${email} failed: ${err}`);
  return s;
}

/** Bearer-token client for the versioned API. */
export function tokenClient(token: string) {
  return async <T = unknown>(path: string, init: Omit<RequestInit, "body"> & { body?: unknown } = {}) => {
    const body =
      init.body === undefined || typeof init.body === "string" ? init.body : JSON.stringify(init.body);
    const res = await fetch(BASE_URL + path, {
      ...init,
      body: body as BodyInit | undefined,
      headers: {
        authorization: `Bearer ${token}`,
        "content-type": "application/json",
        ...(init.headers as Record<string, string>),
      },
    });
    return res as Response & { json(): Promise<T> };
  };
}
