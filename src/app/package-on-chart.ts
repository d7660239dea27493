// The library pages opened from a package (`?package=…`): which of the package's cranes use a
// library version, and what each puts on that version's pictures (its lift point on the capacity
// chart, the hook height it needs on the working range). A page composes the package and library
// features here, since features do not import each other.
import { useQuery } from '@tanstack/react-query';
import { craneLiftFigures } from '@shared/library/lift-points';
import { readStoredResult } from '@shared/engineering/stored-result';
import { isApiError } from '@/lib/api-client';
import { packageQueryOptions } from '@/features/packages/api/get-package';
import { libraryUsesQueryOptions } from '@/features/library/api/library-uses';
import type { OpenedFromPackage } from '@/features/library/components/configuration-view';

export type PackageOnChartState =
  { state: 'loading' } | { state: 'error'; message: string } | ({ state: 'ready' } & OpenedFromPackage);

/** Undefined when the page was not opened from a package. */
export function usePackageOnChart(packageId: string | undefined): PackageOnChartState | undefined {
  const pkg = useQuery({ ...packageQueryOptions(packageId ?? ''), enabled: !!packageId });
  const uses = useQuery({ ...libraryUsesQueryOptions(packageId ?? ''), enabled: !!packageId });
  if (!packageId) return undefined;
  const failed = pkg.error ?? uses.error;
  if (failed)
    return {
      state: 'error',
      message: isApiError(failed) ? failed.message : 'The package could not be read.',
    };
  if (!pkg.data || !uses.data) return { state: 'loading' };
  const { reference } = pkg.data.package;
  const inputs = pkg.data.current.inputs;
  const result = readStoredResult(pkg.data.current.results);
  const items = uses.data.items;
  return {
    state: 'ready',
    id: packageId,
    reference,
    uses: items,
    onChart: (versionId) => ({
      reference,
      cranes: items
        .filter((u) => u.version.id === versionId)
        .map((u) => craneLiftFigures(inputs, result, u.slot)),
    }),
  };
}
