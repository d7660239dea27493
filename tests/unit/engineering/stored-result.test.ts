// The one reader of stored results: every version the engine has written loads; anything else is null.
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateLift } from '@shared/engineering/evaluate';
import { isLiftResult, readStoredResult } from '@shared/engineering/stored-result';

const input = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));

describe('readStoredResult', () => {
  it('when a result of the current version is read back from JSON, then it is the same result', () => {
    const result = evaluateLift(input, null, { units: 'metric' });
    const stored = JSON.parse(JSON.stringify(result));
    expect(readStoredResult(stored)).toEqual(stored);
    expect(readStoredResult(stored)?.resultVersion).toBe(2);
  });

  it('when a version 1 result (one crane, no cranes or multiCrane) is read, then it still loads', () => {
    const { cranes: _c, multiCrane: _m, ...v1 } = JSON.parse(JSON.stringify(evaluateLift(input, null)));
    const stored = { ...v1, resultVersion: 1 };
    expect(isLiftResult(stored)).toBe(true);
    expect(readStoredResult(stored)?.checks.length).toBeGreaterThan(0);
  });

  it('when the stored value has an unknown version or misses a part, then it reads as null', () => {
    const result = JSON.parse(JSON.stringify(evaluateLift(input, null)));
    expect(readStoredResult({ ...result, resultVersion: 99 })).toBeNull();
    expect(readStoredResult({ ...result, resultVersion: undefined })).toBeNull();
    expect(readStoredResult({ ...result, checks: undefined })).toBeNull();
    expect(readStoredResult({ ...result, policy: null })).toBeNull();
    expect(readStoredResult(null)).toBeNull();
    expect(readStoredResult('{}')).toBeNull();
  });
});
