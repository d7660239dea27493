// The difference between two revisions of a package: every input that changed (by JSON
// path) and every check whose status or value moved, for the engineer's side-by-side view.
import type { Actor } from '@shared/rules/actor';
import type { DataSource } from 'typeorm';
import { readStoredResult } from '@shared/engineering/stored-result';
import { AppError } from '../../lib/app-error';
import { Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

/** Flattens JSON to path → leaf; a { value, unit } quantity stays one leaf. */
export function flatten(value: Json, prefix = '', out = new Map<string, Json>()): Map<string, Json> {
  if (value && typeof value === 'object' && !Array.isArray(value) && !('value' in value && 'unit' in value)) {
    for (const [k, v] of Object.entries(value)) flatten(v, prefix ? `${prefix}.${k}` : k, out);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => flatten(v, `${prefix}[${i}]`, out));
    if (value.length === 0) out.set(prefix, []);
  } else {
    out.set(prefix, value);
  }
  return out;
}

interface CheckLike {
  id: string;
  label: string;
  status: string;
  value: number | null;
  unit: string;
}

export async function compareRevisions(
  ds: DataSource,
  user: Actor,
  packageId: string,
  from: number,
  to: number,
) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const [a, b] = await Promise.all([
    ds.getRepository(Revision).findOneBy({ packageId: pkg.id, number: from }),
    ds.getRepository(Revision).findOneBy({ packageId: pkg.id, number: to }),
  ]);
  if (!a || !b) throw AppError.notFound('revision');
  if (user.role !== 'contractor' && (a.state !== 'submitted' || b.state !== 'submitted'))
    throw AppError.notFound('revision');
  const fa = flatten(a.inputs as Json);
  const fb = flatten(b.inputs as Json);
  const inputs: Array<{ path: string; from: Json | undefined; to: Json | undefined }> = [];
  for (const path of [...new Set([...fa.keys(), ...fb.keys()])].sort()) {
    if (JSON.stringify(fa.get(path)) !== JSON.stringify(fb.get(path)))
      inputs.push({ path, from: fa.get(path), to: fb.get(path) });
  }
  const checksOf = (r: Revision): Map<string, CheckLike> =>
    new Map((readStoredResult(r.results)?.checks ?? []).map((c) => [c.id, c]));
  const ca = checksOf(a);
  const cb = checksOf(b);
  const checks = [...new Set([...ca.keys(), ...cb.keys()])].map((id) => {
    const x = ca.get(id);
    const y = cb.get(id);
    return {
      id,
      label: (y ?? x)!.label,
      unit: (y ?? x)!.unit,
      from: x ? { status: x.status, value: x.value } : null,
      to: y ? { status: y.status, value: y.value } : null,
      changed: x?.status !== y?.status || x?.value !== y?.value,
    };
  });
  return { from, to, inputs, checks };
}
