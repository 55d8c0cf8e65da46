// "Today" as the scout's screens mean it: the calendar day of the device in hand, the day a walk started on it is given.

/** Today's date on the device's own calendar, as YYYY-MM-DD. */
export function localToday(now = new Date()) {
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}
