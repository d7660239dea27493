// Query keys of the fleet library, general to specific; mutations invalidate through them.
export type CraneFilters = {
  q?: string;
  radius?: number;
  radiusUnit?: string;
  capacity?: number;
  capacityUnit?: string;
};

export const libraryKeys = {
  all: ['library'] as const,
  cranes: (filters: CraneFilters) => [...libraryKeys.all, 'cranes', filters] as const,
  crane: (id: string) => [...libraryKeys.all, 'crane', id] as const,
  configuration: (id: string) => [...libraryKeys.all, 'configuration', id] as const,
  version: (id: string) => [...libraryKeys.all, 'version', id] as const,
  uses: (packageId: string) => [...libraryKeys.all, 'uses', packageId] as const,
};
