/** PURE: words for screens. */

/** "Calcium citrate" from "calcium citrate": a heading or a table's first column starts with a capital. */
export function firstUpper(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The unit to show after a name, or null when the name already says it ("pH", "Measured pH") or there is none. */
export function unitNote(name: string, unit: string): string | null {
  const u = unit.trim().toLowerCase();
  return !u || name.trim().toLowerCase().endsWith(u) ? null : unit;
}

/** "Soluble solids (°Brix)", but "pH", not "pH (pH)". */
export function nameWithUnit(name: string, unit: string): string {
  const note = unitNote(name, unit);
  return note ? `${name} (${note})` : name;
}

/** Text closed as a sentence: a full stop unless it already ends in one, "?" or "!" ("Same set?", never "Same set?."). */
export function sentence(text: string): string {
  const trimmed = text.trimEnd();
  return /[.!?…]["'”’)]*$/.test(trimmed) ? trimmed : `${trimmed}.`;
}
