import { useEffect } from 'react';
import type { Recording } from '@shared/schemas/recordings';
import { dismissToast, getToasts, showToast } from '../../../components/ui/toast-store';
import { isSettled } from './get-recording';

/** What the upload says while the worker analyses the night. */
export const ANALYSING_TOAST = 'Recording uploaded. It is being analysed.';
export const ANALYSED_TOAST = 'The analysis has finished: the results are on this page.';
export const ANALYSIS_FAILED_TOAST = 'The analysis could not be finished: the reason is on this page.';

/**
 * Once the results are on screen, "being analysed" is no longer true: the message goes, and if it was still
 * showing, a short one says the results are here (read out by screen readers, who cannot see them appear).
 */
export function useReplaceAnalysingToast(recording: Recording | undefined) {
  const settled = recording ? isSettled(recording) : false;
  const failed = recording?.status === 'failed';
  useEffect(() => {
    if (!settled) return;
    const stale = getToasts().filter((toast) => toast.message === ANALYSING_TOAST);
    if (stale.length === 0) return;
    for (const toast of stale) dismissToast(toast.id);
    showToast(failed ? 'info' : 'ok', failed ? ANALYSIS_FAILED_TOAST : ANALYSED_TOAST);
  }, [settled, failed]);
}
