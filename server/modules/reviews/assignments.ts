// The package's engineers of record over time, newest first: who assigned whom, when, until
// when, and the coordinator's note. The desk's side only (the contractor's view of a package
// names the engineer of record, not the desk's internal hand-overs).
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import type { AssignmentHistory } from '@shared/schemas/reviews';
import { findScopedPackage } from '../packages/package-scope';

export async function assignmentHistory(
  ds: DataSource,
  user: Actor,
  packageId: string,
): Promise<AssignmentHistory> {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const rows: Array<{
    id: string;
    engineer: string;
    assigned_by: string;
    assigned_at: Date;
    ended_at: Date | null;
    note: string | null;
  }> = await ds.query(
    `SELECT a.id, e.name AS engineer, b.name AS assigned_by, a.assigned_at, a.ended_at, a.note
       FROM assignments a JOIN users e ON e.id = a.engineer_id JOIN users b ON b.id = a.assigned_by_id
      WHERE a.package_id = $1 ORDER BY a.assigned_at DESC, a.id DESC`,
    [pkg.id],
  );
  return {
    items: rows.map((r) => ({
      id: r.id,
      engineer: r.engineer,
      assignedBy: r.assigned_by,
      assignedAt: r.assigned_at.toISOString(),
      endedAt: r.ended_at ? r.ended_at.toISOString() : null,
      note: r.note,
    })),
  };
}
