// The form holds every field it has shown, most of them empty. Before the lift is
// validated, checked or saved, empty strings, empty objects and empty lists are left out,
// so an optional group the person never touched does not turn into "… is required".
export function prune(value: unknown): unknown {
  if (value === null || value === undefined || value === '') return undefined;
  if (Array.isArray(value)) {
    const items = value.map(prune).filter((item) => item !== undefined);
    return items.length > 0 ? items : undefined;
  }
  if (typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [key, child] of Object.entries(value as Record<string, unknown>)) {
      // A unit with no number beside it is not an entry.
      if (key === 'unit' && (value as Record<string, unknown>).value === undefined) continue;
      const pruned = prune(child);
      if (pruned !== undefined) out[key] = pruned;
    }
    return Object.keys(out).length > 0 ? out : undefined;
  }
  return value;
}

/** The lift as a JSON object for the server: never undefined, numbers that did not parse dropped. */
export function draftInputs(values: unknown): Record<string, unknown> {
  const pruned = prune(
    JSON.parse(JSON.stringify(values ?? {}, (_key, v) => (Number.isNaN(v) ? undefined : v))),
  );
  return (pruned as Record<string, unknown> | undefined) ?? {};
}
