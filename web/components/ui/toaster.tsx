import { useSyncExternalStore } from 'react';
import { dismissToast, getToasts, subscribeToToasts, type ToastTone } from './toast-store';

const tones: Record<ToastTone, { classes: string; word: string }> = {
  ok: { classes: 'border-ok-200 bg-ok-50 text-ok-800', word: 'Done' },
  danger: { classes: 'border-danger-200 bg-danger-50 text-danger-800', word: 'Problem' },
  info: { classes: 'border-brand-200 bg-brand-50 text-brand-800', word: 'Note' },
};

export function Toaster() {
  const toasts = useSyncExternalStore(subscribeToToasts, getToasts, getToasts);
  return (
    <div
      aria-live="polite"
      className="pointer-events-none fixed inset-x-3 bottom-24 z-50 flex flex-col items-end gap-2 lg:bottom-6 lg:left-auto lg:right-6"
    >
      {toasts.map((toast) => (
        <div
          key={toast.id}
          role="status"
          className={`pointer-events-auto flex w-full max-w-sm items-start gap-3 rounded-xl border p-3 shadow-md ${tones[toast.tone].classes}`}
        >
          <p className="flex-1">
            <span className="font-bold">{tones[toast.tone].word}: </span>
            {toast.message}
          </p>
          <button
            type="button"
            onClick={() => dismissToast(toast.id)}
            className="rounded px-2 font-bold"
            aria-label="Dismiss message"
          >
            ×
          </button>
        </div>
      ))}
    </div>
  );
}
