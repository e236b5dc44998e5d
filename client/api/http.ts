import { askForToken, authHeaders } from "./accessToken.ts";
import { apiErrorFrom } from "./apiError.ts";

/** API paths are relative, so the page works wherever the server mounts it. */
function url(path: string): string {
  return path.startsWith("/") ? path.slice(1) : path;
}

/**
 * fetch with the page's headers; on 401 (a shared server that needs its
 * access token) ask for the token once and try again with it.
 */
async function send(path: string, init: RequestInit = {}): Promise<Response> {
  for (let attempt = 0; ; attempt++) {
    const res = await fetch(url(path), { ...init, headers: { ...authHeaders(), ...(init.headers as Record<string, string> | undefined) } });
    if (res.status !== 401 || attempt >= 3) return res;
    const token = await askForToken(attempt > 0);
    if (token === null) return res;
  }
}

async function readAnswer<T>(res: Response): Promise<T> {
  const text = await res.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  if (!res.ok) throw apiErrorFrom(res.status, body);
  return body as T;
}

/** GET a JSON answer; `query` values that are empty are left out. */
export async function apiGet<T>(path: string, query: Record<string, string | number | undefined> = {}): Promise<T> {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== "") params.set(k, String(v));
  const q = params.toString();
  return readAnswer<T>(await send(path + (q ? `?${q}` : "")));
}

export async function apiPost<T>(path: string, body: unknown): Promise<T> {
  return readAnswer<T>(await send(path, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }));
}

/** POST a multipart form (file uploads). Answers with status 422 still carry a JSON body the caller reads. */
export async function apiUpload<T>(path: string, form: FormData, options: { acceptStatus?: number[] } = {}): Promise<T> {
  const res = await send(path, { method: "POST", body: form });
  if (options.acceptStatus?.includes(res.status)) return (await res.json()) as T;
  return readAnswer<T>(res);
}

export async function apiDelete<T>(path: string): Promise<T> {
  return readAnswer<T>(await send(path, { method: "DELETE" }));
}
