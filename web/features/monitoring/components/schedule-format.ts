// Due dates are calendar days in the programme's zone; read at noon UTC so every browser shows the same day.
const day = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });

export const dueDayText = (dueDate: string) => day.format(new Date(`${dueDate.slice(0, 10)}T12:00:00Z`));

const doneAt = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short' });
export const doneDayText = (iso: string) => doneAt.format(new Date(iso));
