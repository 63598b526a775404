// The shared rule names the other field by its key ("…already chosen for timestampColumn"); say it as the label.
const LABELS: Record<string, string> = {
  timestampColumn: 'Time', dateColumn: 'Date', timeColumn: 'Time of day', spo2Column: 'SpO2', pulseColumn: 'Pulse', statusColumn: 'Device status',
};
export const readable = (message?: string) =>
  message?.replace(/\b(timestampColumn|dateColumn|timeColumn|spo2Column|pulseColumn|statusColumn)\b/g, (key) => LABELS[key]);

// An unchosen select or an empty box sends nothing, so the server applies its own rule for that value.
export const blankIsNone = { setValueAs: (value: string) => value || undefined };
