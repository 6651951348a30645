// Path globs for the config's `ignore` list. Our own small matcher rather than node:path's
// matchesGlob, which prints an ExperimentalWarning on Node 20 (seen on 20.20.2).
// Dynamic programming over (pattern token, path offset): time is bounded by their product, so a
// pathological pattern such as "*a*a*a*a*b" cannot make a run hang the way a backtracking RegExp can.

type Token =
  | { t: "char"; c: string }
  | { t: "one" }
  | { t: "star" }
  | { t: "any" }
  | { t: "dirs" } // "**/": nothing, or any run of whole folders ending in "/"
  | { t: "rest" } // "/**" at the end: nothing, or "/" and anything after it
  | { t: "class"; negate: boolean; ranges: [string, string][] };

function tokenize(pattern: string): Token[] {
  const tokens: Token[] = [];
  for (let i = 0; i < pattern.length; i++) {
    const c = pattern[i] as string;
    if (c === "*" && pattern[i + 1] === "*") {
      const atStart = i === 0 || pattern[i - 1] === "/";
      if (atStart && pattern[i + 2] === "/") {
        tokens.push({ t: "dirs" });
        i += 2;
      } else if (i > 0 && pattern[i - 1] === "/" && i + 2 === pattern.length) {
        tokens.pop(); // the "/" before it belongs to the token
        tokens.push({ t: "rest" });
        i += 1;
      } else {
        tokens.push({ t: "any" });
        i += 1;
      }
    } else if (c === "*") {
      tokens.push({ t: "star" });
    } else if (c === "?") {
      tokens.push({ t: "one" });
    } else if (c === "[") {
      const close = pattern.indexOf("]", i + 2);
      if (close < 0) {
        tokens.push({ t: "char", c });
        continue;
      }
      let body = pattern.slice(i + 1, close);
      const negate = body.startsWith("!") || body.startsWith("^");
      if (negate) body = body.slice(1);
      const ranges: [string, string][] = [];
      for (let k = 0; k < body.length; k++) {
        const from = body[k] as string;
        if (body[k + 1] === "-" && k + 2 < body.length) {
          ranges.push([from, body[k + 2] as string]);
          k += 2;
        } else ranges.push([from, from]);
      }
      tokens.push({ t: "class", negate, ranges });
      i = close;
    } else {
      tokens.push({ t: "char", c });
    }
  }
  return tokens;
}

function matchTokens(tokens: Token[], text: string): boolean {
  const n = text.length;
  // next[s] = do tokens p+1.. match text from s; filled from the last token backwards.
  let next: boolean[] = new Array<boolean>(n + 1).fill(false);
  next[n] = true;
  for (let p = tokens.length - 1; p >= 0; p--) {
    const token = tokens[p] as Token;
    const cur: boolean[] = new Array<boolean>(n + 1).fill(false);
    // acc carries "some later offset k satisfies the token's tail" while s walks down.
    let acc = false;
    for (let s = n; s >= 0; s--) {
      const ch = text[s];
      switch (token.t) {
        case "char":
          cur[s] = ch === token.c && next[s + 1] === true;
          break;
        case "one":
          cur[s] = ch !== undefined && ch !== "/" && next[s + 1] === true;
          break;
        case "class": {
          const inClass = ch !== undefined && ch !== "/" && token.ranges.some(([a, b]) => ch >= a && ch <= b);
          cur[s] = ch !== undefined && ch !== "/" && inClass !== token.negate && next[s + 1] === true;
          break;
        }
        case "star":
          cur[s] = next[s] === true || (ch !== undefined && ch !== "/" && cur[s + 1] === true);
          break;
        case "any":
          cur[s] = next[s] === true || (ch !== undefined && cur[s + 1] === true);
          break;
        case "dirs":
          // k ranges over s+1..n with text[k-1] === "/"
          if (s < n && text[s] === "/" && next[s + 1] === true) acc = true;
          cur[s] = next[s] === true || acc;
          break;
        case "rest":
          if (s < n && next[s + 1] === true) acc = true;
          cur[s] = next[s] === true || (ch === "/" && (acc || next[s + 1] === true));
          break;
      }
    }
    next = cur;
  }
  return next[0] === true;
}

/** Forward slashes, no leading "./". */
export function normalizePath(path: string): string {
  let p = path.replace(/\\/g, "/");
  while (p.startsWith("./")) p = p.slice(2);
  return p;
}

/**
 * Whether `path` (relative, either slash) matches `glob`. `*` and `?` stay within a folder name,
 * `**` crosses folders, `[a-z]` is a class. As in .gitignore files, a glob with no "/" matches a name
 * at any depth, and a glob that matches a folder matches everything inside it — unless `anchored`,
 * which matches the whole path only (for paths given on a command line).
 */
export function matchesGlob(path: string, glob: string, options: { anchored?: boolean } = {}): boolean {
  const target = normalizePath(path);
  let pattern = normalizePath(glob.trim());
  if (pattern === "") return false;
  if (pattern.endsWith("/")) pattern = pattern.slice(0, -1);
  if (options.anchored) return matchTokens(tokenize(pattern), target);
  if (!pattern.includes("/")) pattern = `**/${pattern}`;
  if (pattern.startsWith("/")) pattern = pattern.slice(1);
  const tokens = tokenize(pattern);
  if (matchTokens(tokens, target)) return true;
  // A folder match covers its contents: try every leading folder of the path.
  for (let i = target.indexOf("/"); i >= 0; i = target.indexOf("/", i + 1)) {
    if (matchTokens(tokens, target.slice(0, i))) return true;
  }
  return false;
}

/** Whether a path argument is a glob rather than a plain path. */
export function isGlob(text: string): boolean {
  return /[*?[]/.test(text);
}
