// Submitting a revision: first every field and the lift plan PDF are checked here (the steps
// with errors get their mark), then the person confirms, the latest edits are saved, and the
// server's answer is mapped back onto the fields it names.
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { PackageDetail } from '@shared/schemas/packages';
import { isApiError, type FieldError } from '@/lib/api-client';
import { stepOfPath, type StepId } from '@shared/catalogue/lift-fields';
import { readableField } from '@shared/catalogue/readable-issue';
import { useSubmitPackage } from '../api/submit-package';
import { liftPath, type useLiftForm } from './use-lift-form';

export type Problem = { step: StepId; label: string; message: string };

const PACKAGE_FIELDS = ['title', 'siteId', 'plannedLiftDate'];

function mapFieldErrors(fields: FieldError[]): Problem[] {
  return fields.map((field) => ({
    step: stepOfPath(field.path),
    label: readableField(field.path),
    message: field.message,
  }));
}

export function useSubmitRevision({
  detail,
  form,
  flush,
  onShowAll,
}: {
  detail: PackageDetail;
  form: ReturnType<typeof useLiftForm>;
  /** Saves what is not saved yet; false when that failed. */
  flush: () => Promise<boolean>;
  onShowAll: () => void;
}) {
  const navigate = useNavigate();
  const packageId = detail.package.id;
  const submit = useSubmitPackage();
  const [serverProblems, setServerProblems] = useState<Problem[]>([]);
  const [planMissing, setPlanMissing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  async function start() {
    setMessage(null);
    onShowAll();
    const valid = await form.trigger();
    const hasPlan = detail.current.files.some((file) => file.kind === 'lift_plan');
    setPlanMissing(!hasPlan);
    if (!valid || !hasPlan) {
      setMessage(
        !valid
          ? 'Some fields need attention before this revision can be submitted. The steps marked ✕ have errors.'
          : 'Add the lift plan PDF before submitting.',
      );
      return;
    }
    setConfirming(true);
  }

  async function confirm() {
    setMessage(null);
    const saved = await flush();
    if (!saved) {
      setConfirming(false);
      setMessage(
        'The latest changes could not be saved, so the revision was not submitted. Save first, then submit.',
      );
      return;
    }
    submit.mutate(packageId, {
      onSuccess: () => navigate(`/packages/${packageId}`),
      onError: (error) => {
        setConfirming(false);
        if (!isApiError(error)) {
          setMessage('The revision could not be submitted. Try again.');
          return;
        }
        if (error.code === 'lift_plan_missing') {
          setPlanMissing(true);
          setMessage(error.message || 'Add the lift plan PDF before submitting.');
          return;
        }
        if (error.fields.length > 0) {
          setServerProblems(mapFieldErrors(error.fields));
          for (const field of error.fields) {
            const path = field.path.replace(/^inputs\./, '');
            if (path && !PACKAGE_FIELDS.includes(path))
              form.setError(liftPath(path), { type: 'server', message: field.message });
          }
          setMessage(
            `The server found ${error.fields.length} ${error.fields.length === 1 ? 'problem' : 'problems'} in the lift data. The steps marked ✕ have errors.`,
          );
          return;
        }
        setMessage(error.message);
      },
    });
  }

  return {
    start,
    confirm,
    cancel: () => setConfirming(false),
    confirming,
    pending: submit.isPending,
    message,
    serverProblems,
    planMissing,
  };
}
