// File-version stamps (YYYYMMDD) at which the schematic format changed in ways the reader must
// follow (KiCad format notes §2 and §11).

/** Oldest s-expression schematic stamp seen (6.0 development); older files get a note. */
export const OLDEST_KNOWN_VERSION = 20200310;
/** Newest stamp this reader was written against; newer files are read with a note. */
export const NEWEST_KNOWN_VERSION = 20260101;
/** Before this stamp `~` in a name, number or field means "empty". */
export const TILDE_IS_LITERAL_FROM = 20250318;
/** From this stamp a power symbol names its net by Value; before, by its power_in pin name. */
export const POWER_NAME_FROM_VALUE = 20230221;
/** After the 6.0 release stamp, default net names use pin names (`Net-(U3A-IN+)`). */
export const KICAD6_RELEASE_VERSION = 20211123;

/** Field text with the pre-20250318 `~` = empty convention applied. */
export function fieldText(text: string, version: number): string {
  return text === "~" && version < TILDE_IS_LITERAL_FROM ? "" : text;
}
