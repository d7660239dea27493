// The stamp job's steps as the job reports them in its progress (5, 20, 40, 85, 100).
export const STAMP_STEPS = [
  { from: 0, label: 'Reading the review' },
  { from: 20, label: 'Reading the original pages' },
  { from: 40, label: 'Burning in the markups and the stamp' },
  { from: 85, label: 'Storing the stamped return' },
] as const;

/** Index of the step under way at this progress (the last step once past 85). */
export function stepAt(progress: number): number {
  let index = 0;
  STAMP_STEPS.forEach((step, i) => {
    if (progress >= step.from) index = i;
  });
  return index;
}

export function shortHash(sha256: string): string {
  return `${sha256.slice(0, 12)}…${sha256.slice(-4)}`;
}
