/** `?page=1&sort=date&…` from a list query object; empty and undefined values are left out. */
export function toSearch(query: object): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== null && v !== "") params.set(k, String(v));
  const s = params.toString();
  return s ? `?${s}` : "";
}
