// The unit system the package's documents use (the stamped return, its calculation sheet):
// chosen by the job, not by whoever reads, decides or issues. The screens keep the reader's own.
import type { PackageDetail } from '@shared/schemas/packages';
import { UNIT_SYSTEM_WORDS } from '@shared/vocabulary/units';

export function DocumentUnits({ units }: { units: PackageDetail['documentUnits'] }) {
  const words = UNIT_SYSTEM_WORDS[units.system];
  return (
    <section aria-labelledby="document-units-title" className="border border-rule bg-sheet px-3 py-2">
      <h2 id="document-units-title" className="text-[14px] font-bold">
        Units of the stamped return
      </h2>
      <p className="mt-1 text-[13px]">
        <span className="font-bold">{words.charAt(0).toUpperCase() + words.slice(1)}</span>
        {units.source === 'site'
          ? ', set for every package of this site.'
          : ", the contractor's when the package was created."}
      </p>
      <p className="mt-1 text-[12px] text-ink-soft">
        The whole return uses it, whoever issues it; these screens show your own units.
      </p>
    </section>
  );
}
