/** When a survey was taken, from its first and last sample times as written: "2026-08-12 08:15 to 17:00", "2026-08-12 to 2026-08-13", or "—". */
export function surveyPeriod(first: string | null, last: string | null): string {
  if (!first) return "—";
  const show = (t: string) => t.replace("T", " ");
  if (!last || last === first) return show(first);
  const [fd, ft] = first.split("T");
  const [ld, lt] = last.split("T");
  if (fd === ld && ft && lt) return `${fd} ${ft} to ${lt}`;
  return `${show(first)} to ${show(last)}`;
}
