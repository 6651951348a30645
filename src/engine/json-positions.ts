// A small strict JSON reader that keeps the line and column of every key and value, so config
// errors can point at the exact spot ("loadline.json:3:5"). JSON.parse gives neither.

export interface Position {
  /** 1-based. */
  line: number;
  /** 1-based, in UTF-16 code units like most editors' column counters. */
  column: number;
}

export type JsonNode =
  | { kind: "object"; pos: Position; entries: JsonEntry[] }
  | { kind: "array"; pos: Position; items: JsonNode[] }
  | { kind: "string"; pos: Position; value: string }
  | { kind: "number"; pos: Position; value: number }
  | { kind: "boolean"; pos: Position; value: boolean }
  | { kind: "null"; pos: Position };

export interface JsonEntry {
  key: string;
  keyPos: Position;
  value: JsonNode;
}

export interface JsonSyntaxError extends Position {
  message: string;
}

export type JsonParseResult = { ok: true; node: JsonNode } | { ok: false; error: JsonSyntaxError };

/** Nesting deeper than this is not a config file; refuse rather than exhaust the stack. */
const MAX_DEPTH = 64;

class Failure {
  constructor(readonly offset: number, readonly message: string) {}
}

export function parseJsonWithPositions(source: string): JsonParseResult {
  // Editors do not count a byte-order mark as a column.
  const text = source.startsWith("\uFEFF") ? source.slice(1) : source;
  const lineStarts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) lineStarts.push(i + 1);
  const positionOf = (offset: number): Position => {
    let lo = 0;
    let hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if ((lineStarts[mid] ?? 0) <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: offset - (lineStarts[lo] ?? 0) + 1 };
  };

  let i = 0;
  const fail = (message: string, at = i): never => {
    throw new Failure(at, message);
  };
  const describe = (at: number): string => (at >= text.length ? "end of file" : `'${text[at]}'`);
  const skipSpace = (): void => {
    while (i < text.length) {
      const c = text[i];
      if (c === " " || c === "\t" || c === "\n" || c === "\r") i++;
      else if (c === "/" && (text[i + 1] === "/" || text[i + 1] === "*")) {
        fail("comments are not allowed in JSON");
      } else break;
    }
  };

  const readString = (): string => {
    const start = i;
    i++; // opening quote
    let out = "";
    while (true) {
      if (i >= text.length) fail("unterminated string", start);
      const c = text[i] as string;
      const code = c.charCodeAt(0);
      if (c === '"') {
        i++;
        return out;
      }
      if (code < 0x20) fail("control character in string (write it as an escape such as \\n)");
      if (c === "\\") {
        const e = text[i + 1];
        const simple: Record<string, string> = { '"': '"', "\\": "\\", "/": "/", b: "\b", f: "\f", n: "\n", r: "\r", t: "\t" };
        if (e !== undefined && simple[e] !== undefined) {
          out += simple[e];
          i += 2;
        } else if (e === "u") {
          const hex = text.slice(i + 2, i + 6);
          if (!/^[0-9a-fA-F]{4}$/.test(hex)) fail("expected four hex digits after \\u");
          out += String.fromCharCode(parseInt(hex, 16));
          i += 6;
        } else {
          fail(`unknown escape '\\${e ?? ""}' in string`);
        }
      } else {
        out += c;
        i++;
      }
    }
  };

  const readNumber = (): number => {
    const match = /^-?(0|[1-9][0-9]*)(\.[0-9]+)?([eE][+-]?[0-9]+)?/.exec(text.slice(i, i + 400));
    if (!match) return fail(`expected a value but found ${describe(i)}`);
    i += match[0].length;
    return Number(match[0]);
  };

  const readValue = (depth: number): JsonNode => {
    if (depth > MAX_DEPTH) fail(`nesting deeper than ${MAX_DEPTH} levels`);
    skipSpace();
    const pos = positionOf(i);
    const c = text[i];
    if (c === "{") {
      i++;
      const entries: JsonEntry[] = [];
      const seen = new Set<string>();
      skipSpace();
      if (text[i] === "}") {
        i++;
        return { kind: "object", pos, entries };
      }
      while (true) {
        skipSpace();
        if (text[i] !== '"') fail(`expected a key in double quotes but found ${describe(i)}`);
        const keyOffset = i;
        const key = readString();
        if (seen.has(key)) fail(`key '${key}' appears twice`, keyOffset);
        seen.add(key);
        skipSpace();
        if (text[i] !== ":") fail(`expected ':' after key '${key}' but found ${describe(i)}`);
        i++;
        const value = readValue(depth + 1);
        entries.push({ key, keyPos: positionOf(keyOffset), value });
        skipSpace();
        if (text[i] === ",") {
          i++;
          skipSpace();
          if (text[i] === "}") fail("trailing comma before '}'");
          continue;
        }
        if (text[i] === "}") {
          i++;
          return { kind: "object", pos, entries };
        }
        fail(`expected ',' or '}' but found ${describe(i)}`);
      }
    }
    if (c === "[") {
      i++;
      const items: JsonNode[] = [];
      skipSpace();
      if (text[i] === "]") {
        i++;
        return { kind: "array", pos, items };
      }
      while (true) {
        items.push(readValue(depth + 1));
        skipSpace();
        if (text[i] === ",") {
          i++;
          skipSpace();
          if (text[i] === "]") fail("trailing comma before ']'");
          continue;
        }
        if (text[i] === "]") {
          i++;
          return { kind: "array", pos, items };
        }
        fail(`expected ',' or ']' but found ${describe(i)}`);
      }
    }
    if (c === '"') return { kind: "string", pos, value: readString() };
    if (text.startsWith("true", i)) {
      i += 4;
      return { kind: "boolean", pos, value: true };
    }
    if (text.startsWith("false", i)) {
      i += 5;
      return { kind: "boolean", pos, value: false };
    }
    if (text.startsWith("null", i)) {
      i += 4;
      return { kind: "null", pos };
    }
    if (c === "-" || (c !== undefined && c >= "0" && c <= "9")) return { kind: "number", pos, value: readNumber() };
    return fail(`expected a value but found ${describe(i)}`);
  };

  try {
    const node = readValue(0);
    skipSpace();
    if (i < text.length) fail(`unexpected ${describe(i)} after the end of the JSON value`);
    return { ok: true, node };
  } catch (err) {
    if (err instanceof Failure) {
      return { ok: false, error: { ...positionOf(err.offset), message: err.message } };
    }
    throw err;
  }
}

/** The plain JavaScript value of a node (what JSON.parse would give). */
export function plainValue(node: JsonNode): unknown {
  switch (node.kind) {
    case "object": {
      const out: Record<string, unknown> = {};
      for (const entry of node.entries) out[entry.key] = plainValue(entry.value);
      return out;
    }
    case "array":
      return node.items.map(plainValue);
    case "null":
      return null;
    default:
      return node.value;
  }
}
