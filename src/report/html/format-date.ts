const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** Short label `29 Mar` for a local date `YYYY-MM-DD` or a wall-clock epoch (UTC fields read). */
export function formatDate(date: string | number): string {
  const d = typeof date === 'number' ? new Date(date) : new Date(`${date}T00:00:00Z`);
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]}`;
}
