export type ToastTone = 'ok' | 'danger' | 'info';
export interface Toast {
  id: number;
  tone: ToastTone;
  message: string;
}

const VISIBLE_MS = 6000;
let toasts: readonly Toast[] = [];
let nextId = 1;
const listeners = new Set<() => void>();

function emit() {
  for (const listener of listeners) listener();
}

export function dismissToast(id: number): void {
  toasts = toasts.filter((toast) => toast.id !== id);
  emit();
}

export function showToast(tone: ToastTone, message: string): void {
  // The same failure reported by several queries at once should read as one message.
  if (toasts.some((toast) => toast.message === message)) return;
  const id = nextId++;
  toasts = [...toasts, { id, tone, message }];
  emit();
  setTimeout(() => dismissToast(id), VISIBLE_MS);
}

export function subscribeToToasts(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export const getToasts = (): readonly Toast[] => toasts;

export function clearToasts(): void {
  toasts = [];
  emit();
}
