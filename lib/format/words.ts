/** PURE: words for screens. */

/** "Calcium citrate" from "calcium citrate": a heading or a table's first column starts with a capital. */
export function firstUpper(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
