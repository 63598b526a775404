import { useSyncExternalStore } from 'react';
import { dismissToast, getToasts, pauseToasts, resumeToasts, subscribeToToasts, type ToastTone } from './toast-store';

const tones: Record<ToastTone, { classes: string; word: string }> = {
  ok: { classes: 'border-ok-200 bg-ok-50 text-ok-800', word: 'Done' },
  danger: { classes: 'border-danger-200 bg-danger-50 text-danger-800', word: 'Problem' },
  info: { classes: 'border-brand-200 bg-brand-50 text-brand-800', word: 'Note' },
};

/**
 * One polite live region, always in the page so screen readers are listening before a message arrives; the
 * messages inside are plain text, never live regions of their own. Confirmations stay 20 s, paused while hovered
 * or focused; problems stay until dismissed. Focus itself moves to the result of a save (see DEVELOPERS.md), so a
 * toast is a second signal, never the only one.
 */
export function Toaster() {
  const toasts = useSyncExternalStore(subscribeToToasts, getToasts, getToasts);
  return (
    <div
      role="status"
      aria-live="polite"
      aria-label="Messages"
      onPointerEnter={pauseToasts}
      onPointerLeave={resumeToasts}
      onFocus={pauseToasts}
      onBlur={(event) => {
        if (!event.currentTarget.contains(event.relatedTarget as Node | null)) resumeToasts();
      }}
      className="pointer-events-none fixed inset-x-3 bottom-24 z-50 flex flex-col items-end gap-2 lg:bottom-6 lg:left-auto lg:right-6"
    >
      {toasts.map((toast) => (
        <div
          key={toast.id}
          className={`pointer-events-auto flex w-full max-w-sm items-start gap-3 rounded-xl border p-3 shadow-md ${tones[toast.tone].classes}`}
        >
          <p className="flex-1">
            <span className="font-bold">{tones[toast.tone].word}: </span>
            {toast.message}
          </p>
          <button
            type="button"
            onClick={() => dismissToast(toast.id)}
            className="min-h-9 min-w-9 rounded px-2 font-bold"
            aria-label={`Dismiss: ${toast.message}`}
          >
            ×
          </button>
        </div>
      ))}
    </div>
  );
}
