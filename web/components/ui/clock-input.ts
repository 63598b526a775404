/**
 * Times are typed and shown on the 24-hour clock everywhere. A plain text box is used rather than the browser's
 * time box, which follows the device's locale and may show "am"/"pm"; the shared schemas check the "HH:MM" form.
 */
export const CLOCK_INPUT = { type: 'text', placeholder: 'HH:MM', maxLength: 5, autoComplete: 'off' } as const;
export const CLOCK_HINT = '24-hour clock, e.g. 14:30';
