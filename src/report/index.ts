// One entry for every output format, so the CLI and the Action render the same way.
import type { LintResult } from "../engine/result.js";
import type { Colors } from "./colors.js";
import { noColors } from "./colors.js";
import { formatAnnotations } from "./github.js";
import { formatHtml } from "./html.js";
import { formatJson } from "./json.js";
import { formatMarkdown } from "./markdown.js";
import type { PathBase } from "./paths.js";
import { formatSarif } from "./sarif.js";
import { formatText } from "./text.js";

export const FORMATS = ["text", "json", "sarif", "github", "markdown", "html"] as const;
export type Format = (typeof FORMATS)[number];

export function isFormat(text: string): text is Format {
  return (FORMATS as readonly string[]).includes(text);
}

export interface RenderOptions extends PathBase {
  colors?: Colors;
  showSuppressed?: boolean;
}

/** The report in one format. The terminal text is relative to the working directory; the others (JSON too)
 * to `root` (repository or workspace), which is what code scanning and annotations resolve against. */
export function render(format: Format, result: LintResult, options: RenderOptions): string {
  const base = { cwd: options.cwd, root: options.root };
  switch (format) {
    case "text":
      return formatText(result, { cwd: options.cwd, root: options.cwd, colors: options.colors ?? noColors, showSuppressed: options.showSuppressed ?? false });
    case "json":
      return formatJson(result, base);
    case "sarif":
      return formatSarif(result, base);
    case "github": {
      const { lines } = formatAnnotations(result, { ...base, overflowPlace: "the JSON or SARIF report" });
      return lines.length > 0 ? `${lines.join("\n")}\n` : "";
    }
    case "markdown":
      return formatMarkdown(result, base);
    case "html":
      return formatHtml(result, base);
  }
}
