export type ToastTone = 'ok' | 'danger' | 'info';
export interface Toast {
  id: number;
  tone: ToastTone;
  message: string;
}

/**
 * How long a confirmation stays (WCAG 2.2.1): long enough to read twice at a slow pace, and the clock stops while
 * the pointer or focus is on the messages. A problem stays until it is dismissed: it may need acting on.
 */
export const TOAST_VISIBLE_MS = 20_000;

let toasts: readonly Toast[] = [];
let nextId = 1;
let paused = false;
const listeners = new Set<() => void>();
// Time left for each timed toast, and the running timers while not paused.
const remaining = new Map<number, { ms: number; startedAt: number; timer?: ReturnType<typeof setTimeout> }>();

function emit() {
  for (const listener of listeners) listener();
}

function start(id: number) {
  const entry = remaining.get(id);
  if (!entry || paused) return;
  entry.startedAt = Date.now();
  entry.timer = setTimeout(() => dismissToast(id), entry.ms);
}

export function dismissToast(id: number): void {
  const entry = remaining.get(id);
  if (entry?.timer) clearTimeout(entry.timer);
  remaining.delete(id);
  toasts = toasts.filter((toast) => toast.id !== id);
  emit();
}

export function showToast(tone: ToastTone, message: string): void {
  // The same failure reported by several queries at once should read as one message.
  if (toasts.some((toast) => toast.message === message)) return;
  const id = nextId++;
  toasts = [...toasts, { id, tone, message }];
  if (tone !== 'danger') {
    remaining.set(id, { ms: TOAST_VISIBLE_MS, startedAt: Date.now() });
    start(id);
  }
  emit();
}

/** Stops every toast's clock while someone reads or reaches for them (pointer over, or focus inside). */
export function pauseToasts(): void {
  if (paused) return;
  paused = true;
  for (const entry of remaining.values()) {
    if (entry.timer) clearTimeout(entry.timer);
    entry.timer = undefined;
    entry.ms = Math.max(0, entry.ms - (Date.now() - entry.startedAt));
  }
}

export function resumeToasts(): void {
  if (!paused) return;
  paused = false;
  // At least a few seconds more after reading, so a message never vanishes the instant the pointer leaves.
  for (const [id, entry] of remaining) {
    entry.ms = Math.max(entry.ms, 5000);
    start(id);
  }
}

export function subscribeToToasts(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export const getToasts = (): readonly Toast[] => toasts;

export function clearToasts(): void {
  for (const entry of remaining.values()) if (entry.timer) clearTimeout(entry.timer);
  remaining.clear();
  paused = false;
  toasts = [];
  emit();
}
