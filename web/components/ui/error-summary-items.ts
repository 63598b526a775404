/** One problem in a form, read from the page itself so the summary says exactly what is shown beside the field. */
export interface ErrorItem {
  /** The control to take the person to. */
  target: HTMLElement;
  key: string;
  text: string;
}

const clean = (text: string | null | undefined) => (text ?? '').replace(/^\s*⚠\s*/, '').replace(/\s+/g, ' ').trim();

function labelOf(control: HTMLElement): string {
  if (control instanceof HTMLFieldSetElement) return clean(control.querySelector('legend')?.textContent);
  const labelled = control.getAttribute('aria-labelledby');
  if (labelled) return clean(labelled.split(/\s+/).map((id) => document.getElementById(id)?.textContent).join(' '));
  const own = control.getAttribute('aria-label');
  if (own) return clean(own);
  const labels = (control as HTMLInputElement).labels;
  return clean(labels?.[0]?.textContent);
}

function messageOf(control: HTMLElement): string {
  // Fields list their hint first and their error last (see describedBy in field.tsx).
  const ids = (control.getAttribute('aria-describedby') ?? '').split(/\s+/).filter(Boolean);
  for (const id of ids.reverse()) {
    const text = clean(document.getElementById(id)?.textContent);
    if (text && (id.endsWith('-error') || ids.length === 1)) return text;
  }
  return 'Check this answer';
}

function focusTarget(control: HTMLElement): HTMLElement {
  if (!(control instanceof HTMLFieldSetElement)) return control;
  return control.querySelector<HTMLElement>('input:checked:not(:disabled)') ?? control.querySelector<HTMLElement>('input:not(:disabled), select, textarea') ?? control;
}

/** Every control or group marked aria-invalid inside `scope`, in page order, as "Label: message". */
export function collectErrorItems(scope: ParentNode): ErrorItem[] {
  const items: ErrorItem[] = [];
  const seen = new Set<Element>();
  for (const control of scope.querySelectorAll<HTMLElement>('[aria-invalid="true"]')) {
    // A group marked invalid speaks for its radios; a radio inside it is not listed twice.
    const group = control.closest('fieldset[aria-invalid="true"]');
    if (group && group !== control) continue;
    if (seen.has(control)) continue;
    seen.add(control);
    const label = labelOf(control);
    const message = messageOf(control);
    const text = !label || message.toLowerCase().startsWith(label.toLowerCase()) ? message : `${label}: ${message}`;
    items.push({ target: focusTarget(control), key: control.id || `${items.length}-${text}`, text });
  }
  return items;
}
