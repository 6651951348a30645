// User text (file names, field values, messages quoting them) reaches terminals and documents.
// These keep it printable without changing what it says.

/** Control characters (C0, DEL, C1) shown as escapes, so a field cannot move the cursor, recolour the
 * terminal or start a new line that looks like one of ours. */
export function printable(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f-\u009f]/g, (c) => {
    if (c === "\n") return "\\n";
    if (c === "\r") return "\\r";
    if (c === "\t") return "\\t";
    return `\\x${c.charCodeAt(0).toString(16).padStart(2, "0")}`;
  });
}

/** At most `max` characters (UTF-16 units, never splitting a surrogate pair), with "…" when cut. */
export function clip(text: string, max: number): string {
  if (text.length <= max) return text;
  let end = Math.max(0, max - 1);
  const code = text.charCodeAt(end - 1);
  if (code >= 0xd800 && code <= 0xdbff) end--;
  return `${text.slice(0, end)}…`;
}

const HTML_ENTITIES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

/** Escapes for HTML text and attribute values (both quote kinds, so either quoting is safe). Control
 * characters, which neither HTML nor XML may carry, become U+FFFD. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"'\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, (c) => HTML_ENTITIES[c] ?? "\ufffd");
}
