/** Soonest target publish date first; roundups without one last. */
export function byTargetDate(a: { targetPublishDate: string | null }, b: { targetPublishDate: string | null }) {
  if (a.targetPublishDate === b.targetPublishDate) return 0;
  if (a.targetPublishDate === null) return 1;
  if (b.targetPublishDate === null) return -1;
  return a.targetPublishDate < b.targetPublishDate ? -1 : 1;
}
