/**
 * The one fetch client of the app. Every API error arrives as { error: { code, message, details } }
 * and is thrown as an ApiError so forms can put `details` on the fields they name.
 */
export interface ApiErrorBody {
  code: string;
  message: string;
  details?: unknown;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = "ApiError";
  }

  /** Field-level messages, keyed by dotted field path, when the server sent them. */
  fieldMessages(): Record<string, string> {
    const out: Record<string, string> = {};
    if (Array.isArray(this.details)) {
      for (const d of this.details as Array<{ field?: unknown; message?: unknown }>) {
        if (typeof d.field === "string" && typeof d.message === "string") out[d.field] ??= d.message;
      }
    }
    return out;
  }
}

type RequestHeaderHook = (method: string) => Promise<Record<string, string>> | Record<string, string>;

export interface RequestHookOptions {
  /** Sees every response, e.g. to pick up a fresh token from a response header. */
  onResponse?: (res: Response) => void;
  /** True to send the request once more after this error (the hook has refreshed its state). */
  retryOn?: (err: ApiError) => boolean;
}
const headerHooks: Array<{ headers: RequestHeaderHook } & RequestHookOptions> = [];

/** Lets a feature add headers to requests (e.g. the CSRF token) and react to their answers. */
export function addRequestHeaderHook(hook: RequestHeaderHook, options: RequestHookOptions = {}): void {
  headerHooks.push({ headers: hook, ...options });
}

export interface RequestOptions {
  method?: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  body?: unknown;
  signal?: AbortSignal;
}

export async function apiFetch<T>(path: string, options: RequestOptions = {}): Promise<T> {
  try {
    return await send<T>(path, options);
  } catch (err) {
    if (err instanceof ApiError && headerHooks.some((h) => h.retryOn?.(err))) return send<T>(path, options);
    throw err;
  }
}

async function send<T>(path: string, { method = "GET", body, signal }: RequestOptions): Promise<T> {
  const headers: Record<string, string> = { Accept: "application/json" };
  for (const hook of headerHooks) Object.assign(headers, await hook.headers(method));
  let payload: BodyInit | undefined;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers["Content-Type"] = "application/json";
    payload = JSON.stringify(body);
  }
  let res: Response;
  try {
    res = await fetch(`/api${path}`, { method, headers, body: payload, signal, credentials: "same-origin" });
  } catch (err) {
    if ((err as Error).name === "AbortError") throw err;
    throw new ApiError(0, "network", "Rhomb's server cannot be reached. Check your connection; nothing was sent.");
  }
  for (const hook of headerHooks) hook.onResponse?.(res);
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  const data = text ? safeJson(text) : undefined;
  if (!res.ok) {
    const e = (data as { error?: ApiErrorBody } | undefined)?.error;
    // A body without our error shape (e.g. the health report on 503) travels as the details.
    throw new ApiError(res.status, e?.code ?? "http_" + res.status, e?.message ?? `The server answered ${res.status} ${res.statusText}.`, e ? e.details : data);
  }
  return data as T;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
