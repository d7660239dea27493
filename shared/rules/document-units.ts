// Which unit system a package's documents use: the site's own setting when its admin set one,
// else the package's (its contractor's when the package was created). Never the unit system of
// the person who opens, decides or issues: one system per document, chosen by the job.
import type { UnitSystem } from '../schemas/common';

export type DocumentUnitsSource = 'package' | 'site';

export function documentUnits(
  pkg: { unitSystem: UnitSystem },
  site: { unitSystem: UnitSystem | null },
): { system: UnitSystem; source: DocumentUnitsSource } {
  return site.unitSystem
    ? { system: site.unitSystem, source: 'site' }
    : { system: pkg.unitSystem, source: 'package' };
}
