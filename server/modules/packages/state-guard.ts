// The server's side of the status machine (shared/rules/package-status.ts): a service asks it
// before it changes anything, and a wrong-state action answers 409 with a sentence that names
// the action, when it is allowed and the package's status now.
import { stateRefusal, type PackageAction } from '@shared/rules/package-status';
import type { PackageStatus } from '@shared/schemas/common';
import { AppError } from '../../lib/app-error';

export function requireState(
  action: PackageAction,
  status: PackageStatus,
  what: string,
  code = 'wrong_state',
): void {
  const refusal = stateRefusal(action, status, what);
  if (refusal) throw new AppError(409, code, refusal);
}
