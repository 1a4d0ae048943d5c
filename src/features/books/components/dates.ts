/** Today's calendar date where the user is (YYYY-MM-DD), not in UTC: a count or waste happens on the café's day. */
export function localToday(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/** This month where the user is (YYYY-MM). */
export function localMonth(): string {
  return localToday().slice(0, 7);
}
