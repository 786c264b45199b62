import { CsrfTokenSchema } from "@shared/schemas/auth";
import { addRequestHeaderHook } from "./client";

/**
 * The CSRF token of this browser's session, sent in X-CSRF-Token with every write. Fetched on the
 * first write, replaced whenever the server sends a new one (sign-in and sign-out regenerate the
 * session), and fetched again — with the request retried once — if the server calls it stale.
 */
let token: string | undefined;
let pending: Promise<string> | undefined;

async function fetchToken(): Promise<string> {
  const res = await fetch("/api/auth/csrf-token", { headers: { Accept: "application/json" }, credentials: "same-origin" });
  if (!res.ok) throw new Error(`Could not get a security token from the server (${res.status}).`);
  return CsrfTokenSchema.parse(await res.json()).token;
}

const WRITES = new Set(["POST", "PUT", "PATCH", "DELETE"]);

addRequestHeaderHook(
  async (method): Promise<Record<string, string>> => {
    if (!WRITES.has(method)) return {};
    token ??= await (pending ??= fetchToken().finally(() => (pending = undefined)));
    return { "X-CSRF-Token": token };
  },
  {
    onResponse: (res) => {
      const fresh = res.headers.get("X-CSRF-Token");
      if (fresh) token = fresh;
    },
    retryOn: (err) => {
      if (err.code !== "csrf_invalid") return false;
      token = undefined;
      return true;
    },
  },
);
