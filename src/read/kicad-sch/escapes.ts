// KiCad's `{name}` escapes in identifiers (KiCad format notes §12.1, §14): net names escape `/` as
// `{slash}` so sheet paths stay unambiguous; library IDs escape `:` and a few others.

const ESCAPES: Record<string, string> = {
  slash: "/",
  backslash: "\\",
  colon: ":",
  lt: "<",
  gt: ">",
  dblquote: "\"",
  quote: "'",
  tab: "\t",
  return: "\n",
  space: " ",
  comma: ",",
  bar: "|",
  brace: "{",
};

const ESCAPE_PATTERN = /\{(slash|backslash|colon|lt|gt|dblquote|quote|tab|return|space|comma|bar|brace)\}/g;

/** Replaces every known `{name}` escape with its character; unknown braces stay as written. */
export function unescapeKicad(text: string): string {
  return text.includes("{") ? text.replace(ESCAPE_PATTERN, (_, name: string) => ESCAPES[name] ?? "") : text;
}

/** A label's text as it appears inside a net name: `/` escaped, line breaks dropped. */
export function escapeNetText(text: string): string {
  return text.replace(/[\r\n]/g, "").replace(/\//g, "{slash}");
}
