// Join class names, skipping empty values (a tiny stand-in for clsx).
// Enough for our conditional classes; no merging of conflicting utilities.
export function cn(...classes: Array<string | false | null | undefined>): string {
  return classes.filter(Boolean).join(' ');
}
