// The difference between two revisions of a package: every input that changed (by JSON
// path) and every check whose status or value moved, for the engineer's side-by-side view.
import type { Actor } from '@shared/rules/actor';
import type { DataSource } from 'typeorm';
import { readStoredResult } from '@shared/engineering/stored-result';
import { AppError } from '../../lib/app-error';
import type { RevisionCompare } from '@shared/schemas/reviews';
import { UploadedFile } from '../files/file.entity';
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
  const [filesA, filesB] = await Promise.all(
    [a, b].map((r) =>
      ds
        .getRepository(UploadedFile)
        .find({ where: { revisionId: r.id }, order: { createdAt: 'ASC', id: 'ASC' } }),
    ),
  );
  return { from, to, documents: documentChanges(filesA, filesB), inputs, checks };
}

type DocRow = Pick<UploadedFile, 'id' | 'kind' | 'originalName' | 'pages' | 'sha256'>;

/**
 * Document by document: the same bytes in both revisions are unchanged (renamed or not); the lift plan, or a
 * supporting PDF of the same name, with other bytes is replaced; the rest added or removed.
 */
export function documentChanges(before: DocRow[], after: DocRow[]): RevisionCompare['documents'] {
  const side = (f: DocRow) => ({ fileId: f.id, name: f.originalName, pages: f.pages });
  const left = [...before];
  const take = (match: (f: DocRow) => boolean) => {
    const i = left.findIndex(match);
    return i < 0 ? null : left.splice(i, 1)[0];
  };
  const out: RevisionCompare['documents'] = [];
  const pending: DocRow[] = [];
  // The same bytes under the same name first, then the same bytes renamed.
  const unmatched = after.filter((f) => {
    const same = take((g) => g.sha256 === f.sha256 && g.kind === f.kind && g.originalName === f.originalName);
    if (same) out.push({ kind: f.kind, change: 'unchanged', from: side(same), to: side(f) });
    return !same;
  });
  for (const f of unmatched) {
    const same = take((g) => g.sha256 === f.sha256 && g.kind === f.kind);
    if (same) out.push({ kind: f.kind, change: 'unchanged', from: side(same), to: side(f) });
    else pending.push(f);
  }
  for (const f of pending) {
    const was = take((g) =>
      f.kind === 'lift_plan'
        ? g.kind === 'lift_plan'
        : g.kind === 'supporting' && g.originalName === f.originalName,
    );
    out.push(
      was
        ? { kind: f.kind, change: 'replaced', from: side(was), to: side(f) }
        : { kind: f.kind, change: 'added', from: null, to: side(f) },
    );
  }
  for (const g of left) out.push({ kind: g.kind, change: 'removed', from: side(g), to: null });
  const order = { lift_plan: 0, supporting: 1 };
  return out.sort((x, y) => order[x.kind] - order[y.kind]);
}
