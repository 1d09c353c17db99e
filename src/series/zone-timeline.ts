/**
 * The zone in force on each local day: that of the latest day with entries on or before it (the
 * first day's zone before that; `UTC` when there are no days).
 */
export function zoneTimeline(dayZones: ReadonlyMap<number, string>): (day: number) => string {
  const days = [...dayZones.entries()].sort((a, b) => a[0] - b[0]);
  return (day: number) => {
    let lo = 0;
    let hi = days.length - 1;
    if (hi < 0) return 'UTC';
    if (day < (days[0] as [number, string])[0]) return (days[0] as [number, string])[1];
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if ((days[mid] as [number, string])[0] <= day) lo = mid;
      else hi = mid - 1;
    }
    return (days[lo] as [number, string])[1];
  };
}
