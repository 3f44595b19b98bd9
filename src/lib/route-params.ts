/** A record id from a route parameter, or null when the address holds none ("/clients/abc"). */
export function parseId(raw: string | undefined): number | null {
  if (!raw || !/^\d{1,15}$/.test(raw)) return null;
  const id = Number(raw);
  return id > 0 ? id : null;
}
