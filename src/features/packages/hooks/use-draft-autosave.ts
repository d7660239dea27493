// Drafts save themselves: about a second after the last change, and once more when the
// page is hidden or closed. Each save sends the revision's updatedAt this tab last saw; if
// another tab saved in between, the server answers 409 stale_draft and the person chooses
// between the saved version and their own (sent again over it).
import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { PackageDetail, SaveDraftBody } from '@shared/schemas/packages';
import { isApiError } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';
import { saveDraft, saveDraftOnExit } from '../api/save-draft';
import { getPackage } from '../api/get-package';

export const AUTOSAVE_DELAY_MS = 1000;

export type SaveState =
  | { kind: 'saved'; at: Date | null }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'error'; message: string }
  | { kind: 'conflict' }
  | { kind: 'frozen' };

type Payload = Omit<SaveDraftBody, 'baseUpdatedAt'>;

export function useDraftAutosave({
  packageId,
  initial,
  getPayload,
  onReload,
}: {
  packageId: string;
  initial: PackageDetail;
  getPayload: () => Payload;
  /** Called with the stored package when the person chooses the saved version over theirs. */
  onReload: (detail: PackageDetail) => void;
}) {
  const queryClient = useQueryClient();
  const [state, setState] = useState<SaveState>({ kind: 'saved', at: null });
  const base = useRef(initial.current.updatedAt);
  const lastSaved = useRef(JSON.stringify(initial.current.inputs));
  const timer = useRef<number | undefined>(undefined);
  const dirty = useRef(false);
  const inFlight = useRef<Promise<void> | null>(null);
  const blocked = useRef(false);
  const payloadRef = useRef(getPayload);
  const saveRef = useRef<() => Promise<void>>(async () => undefined);
  useEffect(() => {
    payloadRef.current = getPayload;
  });

  const save = useCallback(async (): Promise<void> => {
    if (blocked.current) return;
    if (inFlight.current) {
      await inFlight.current;
      if (!dirty.current) return;
    }
    window.clearTimeout(timer.current);
    timer.current = undefined;
    dirty.current = false;
    const payload = payloadRef.current();
    setState({ kind: 'saving' });
    const run = (async () => {
      try {
        const detail = await saveDraft(packageId, { ...payload, baseUpdatedAt: base.current });
        base.current = detail.current.updatedAt;
        lastSaved.current = JSON.stringify(detail.current.inputs);
        queryClient.setQueryData(packageKeys.detail(packageId), detail);
        void queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
        setState(dirty.current ? { kind: 'pending' } : { kind: 'saved', at: new Date() });
      } catch (error) {
        dirty.current = true;
        if (isApiError(error) && error.code === 'stale_draft') {
          blocked.current = true;
          setState({ kind: 'conflict' });
        } else if (isApiError(error) && error.code === 'already_submitted') {
          blocked.current = true;
          setState({ kind: 'frozen' });
        } else {
          setState({
            kind: 'error',
            message: isApiError(error) ? error.message : 'The draft could not be saved.',
          });
        }
      }
    })();
    inFlight.current = run;
    await run;
    inFlight.current = null;
    if (dirty.current && !blocked.current && timer.current === undefined) {
      // Changes made while the save was on its way go out next.
      timer.current = window.setTimeout(() => {
        timer.current = undefined;
        void saveRef.current();
      }, AUTOSAVE_DELAY_MS);
    }
  }, [packageId, queryClient]);
  useEffect(() => {
    saveRef.current = save;
  }, [save]);

  const schedule = useCallback(() => {
    dirty.current = true;
    if (blocked.current) return;
    setState((current) => (current.kind === 'saving' ? current : { kind: 'pending' }));
    window.clearTimeout(timer.current);
    timer.current = window.setTimeout(() => {
      timer.current = undefined;
      void save();
    }, AUTOSAVE_DELAY_MS);
  }, [save]);

  /** Saves now if anything is unsaved; resolves when the server has it (or has refused it). */
  const flush = useCallback(async () => {
    window.clearTimeout(timer.current);
    timer.current = undefined;
    if (inFlight.current) await inFlight.current;
    if (dirty.current) await save();
    return !dirty.current && !blocked.current;
  }, [save]);

  const keepMine = useCallback(async () => {
    try {
      const fresh = await getPackage(packageId);
      base.current = fresh.current.updatedAt;
      blocked.current = false;
      dirty.current = true;
      await save();
    } catch (error) {
      setState({
        kind: 'error',
        message: isApiError(error) ? error.message : 'The draft could not be saved.',
      });
    }
  }, [packageId, save]);

  const reloadSaved = useCallback(async () => {
    try {
      const fresh = await getPackage(packageId);
      queryClient.setQueryData(packageKeys.detail(packageId), fresh);
      base.current = fresh.current.updatedAt;
      lastSaved.current = JSON.stringify(fresh.current.inputs);
      blocked.current = false;
      dirty.current = false;
      window.clearTimeout(timer.current);
      timer.current = undefined;
      onReload(fresh);
      setState({ kind: 'saved', at: new Date() });
    } catch (error) {
      setState({
        kind: 'error',
        message: isApiError(error) ? error.message : 'The saved draft could not be loaded.',
      });
    }
  }, [packageId, queryClient, onReload]);

  /**
   * After this tab changed the draft's files, the revision's updatedAt moves on; adopt the
   * new one when the stored inputs are still the ones this tab saved last.
   */
  const adopt = useCallback((detail: PackageDetail) => {
    if (JSON.stringify(detail.current.inputs) === lastSaved.current) base.current = detail.current.updatedAt;
  }, []);

  useEffect(() => {
    function onHide() {
      if (dirty.current && !blocked.current) {
        window.clearTimeout(timer.current);
        timer.current = undefined;
        saveDraftOnExit(packageId, { ...payloadRef.current(), baseUpdatedAt: base.current });
      }
    }
    function onVisibility() {
      if (document.visibilityState === 'hidden') onHide();
    }
    window.addEventListener('pagehide', onHide);
    document.addEventListener('visibilitychange', onVisibility);
    return () => {
      window.removeEventListener('pagehide', onHide);
      document.removeEventListener('visibilitychange', onVisibility);
      // Leaving the editor inside the app (a link, sign-out): send what is unsaved.
      onHide();
    };
  }, [packageId]);

  return { state, schedule, flush, keepMine, reloadSaved, adopt, retry: save };
}
