// One JSON text for one value, whatever the order its keys were built in: object keys sorted,
// undefined members left out (as JSON.stringify does), no whitespace. Hashes of audit rows and
// of frozen records are taken over this text, so the same content always gives the same hash.

/** Canonical JSON of a JSON-compatible value (Dates become their ISO text, as in JSON.stringify). */
export function canonicalJson(value: unknown): string {
  return write(JSON.parse(JSON.stringify(value ?? null)) as unknown);
}

function write(v: unknown): string {
  if (v === null || typeof v !== 'object') return JSON.stringify(v);
  if (Array.isArray(v)) return `[${v.map(write).join(',')}]`;
  const o = v as Record<string, unknown>;
  const keys = Object.keys(o).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${write(o[k])}`).join(',')}}`;
}
