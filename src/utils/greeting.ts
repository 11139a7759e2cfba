/** "Good morning" / "Good afternoon" / "Good evening" for the given local time. */
export function greetingFor(now: Date): string {
  const hour = now.getHours()
  if (hour < 12) return 'Good morning'
  if (hour < 18) return 'Good afternoon'
  return 'Good evening'
}
