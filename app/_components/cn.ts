// Join class names, skipping empty values (a tiny stand-in for clsx).
export function cn(...classes: Array<string | false | null | undefined>): string {
  return classes.filter(Boolean).join(' ');
}
