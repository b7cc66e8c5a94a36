/**
 * A small HTML tokenizer for the report tests (tags, attributes, text, comments; `<style>`/`<script>`
 * content as raw text), following the tokenization rules of the WHATWG HTML standard closely enough
 * for well-formed output: it is how a browser would split the report into elements and attributes.
 */

export interface Element {
  name: string;
  attrs: Record<string, string>;
  /** Index of this start tag in `tokens`. */
  index: number;
  selfClosing: boolean;
}

export type Token =
  | { kind: "start"; el: Element }
  | { kind: "end"; name: string }
  | { kind: "text"; text: string }
  | { kind: "comment"; text: string };

const ENTITIES: Record<string, string> = { amp: "&", lt: "<", gt: ">", quot: '"', apos: "'", nbsp: "\u00a0" };

/** Decodes the character references our output uses (named basics and numeric). */
export function decode(text: string): string {
  return text.replace(/&(#x[0-9a-f]+|#[0-9]+|[a-z]+);/gi, (m, ref: string) => {
    if (ref[0] === "#") {
      const code =
        ref[1] === "x" || ref[1] === "X" ? Number.parseInt(ref.slice(2), 16) : Number(ref.slice(1));
      return String.fromCodePoint(code);
    }
    return ENTITIES[ref.toLowerCase()] ?? m;
  });
}

export function tokenize(html: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  const n = html.length;
  while (i < n) {
    const lt = html.indexOf("<", i);
    if (lt < 0) {
      tokens.push({ kind: "text", text: decode(html.slice(i)) });
      break;
    }
    if (lt > i) tokens.push({ kind: "text", text: decode(html.slice(i, lt)) });
    if (html.startsWith("<!--", lt)) {
      const end = html.indexOf("-->", lt + 4);
      const stop = end < 0 ? n : end;
      tokens.push({ kind: "comment", text: html.slice(lt + 4, stop) });
      i = end < 0 ? n : end + 3;
      continue;
    }
    if (html[lt + 1] === "!" || html[lt + 1] === "?") {
      const end = html.indexOf(">", lt);
      i = end < 0 ? n : end + 1;
      continue;
    }
    const endTag = html[lt + 1] === "/";
    const nameMatch = /^[a-zA-Z][^\s/>]*/.exec(html.slice(lt + (endTag ? 2 : 1)));
    if (!nameMatch) {
      // "<" not followed by a tag name is text.
      tokens.push({ kind: "text", text: "<" });
      i = lt + 1;
      continue;
    }
    const name = nameMatch[0].toLowerCase();
    let j = lt + (endTag ? 2 : 1) + nameMatch[0].length;
    const attrs: Record<string, string> = {};
    let selfClosing = false;
    while (j < n) {
      while (j < n && /\s/.test(html[j]!)) j++;
      if (html[j] === ">") {
        j++;
        break;
      }
      if (html[j] === "/" && html[j + 1] === ">") {
        selfClosing = true;
        j += 2;
        break;
      }
      if (html[j] === "/") {
        j++;
        continue;
      }
      const an = /^[^\s/>=]+/.exec(html.slice(j));
      const attrName = an ? an[0].toLowerCase() : html[j]!;
      j += an ? an[0].length : 1;
      while (j < n && /\s/.test(html[j]!)) j++;
      let value = "";
      if (html[j] === "=") {
        j++;
        while (j < n && /\s/.test(html[j]!)) j++;
        const q = html[j];
        if (q === '"' || q === "'") {
          const close = html.indexOf(q, j + 1);
          value = html.slice(j + 1, close < 0 ? n : close);
          j = close < 0 ? n : close + 1;
        } else {
          const un = /^[^\s>]*/.exec(html.slice(j))![0];
          value = un;
          j += un.length;
        }
      }
      if (!(attrName in attrs)) attrs[attrName] = decode(value);
    }
    if (endTag) {
      tokens.push({ kind: "end", name });
    } else {
      const el: Element = { name, attrs, index: tokens.length, selfClosing };
      tokens.push({ kind: "start", el });
      if ((name === "style" || name === "script") && !selfClosing) {
        const close = html.toLowerCase().indexOf(`</${name}`, j);
        const stop = close < 0 ? n : close;
        tokens.push({ kind: "text", text: html.slice(j, stop) });
        j = stop;
      }
    }
    i = j;
  }
  return tokens;
}

export function elements(tokens: Token[]): Element[] {
  return tokens.flatMap((t) => (t.kind === "start" ? [t.el] : []));
}

const VOID = new Set([
  "area",
  "base",
  "br",
  "col",
  "embed",
  "hr",
  "img",
  "input",
  "link",
  "meta",
  "source",
  "track",
  "wbr",
]);

/**
 * Checks that start and end tags nest properly (void elements and `/>` excepted). Returns the first
 * problem, or null when the markup is balanced.
 */
export function nestingProblem(tokens: Token[]): string | null {
  const stack: string[] = [];
  for (const t of tokens) {
    if (t.kind === "start") {
      if (!t.el.selfClosing && !VOID.has(t.el.name)) stack.push(t.el.name);
    } else if (t.kind === "end") {
      const top = stack.pop();
      if (top !== t.name) return `</${t.name}> closes <${top ?? "nothing"}>`;
    }
  }
  return stack.length === 0 ? null : `unclosed <${stack[stack.length - 1]}>`;
}

/** Tokens between a start tag and its matching end tag (exclusive). */
export function inner(tokens: Token[], start: Element): Token[] {
  let depth = 0;
  for (let k = start.index; k < tokens.length; k++) {
    const t = tokens[k]!;
    if (t.kind === "start" && t.el.name === start.name && !t.el.selfClosing) depth++;
    if (t.kind === "end" && t.name === start.name) {
      depth--;
      if (depth === 0) return tokens.slice(start.index + 1, k);
    }
  }
  return tokens.slice(start.index + 1);
}

/** Text content of a token range (style/script raw text included). */
export function textOf(tokens: Token[]): string {
  return tokens
    .filter((t): t is { kind: "text"; text: string } => t.kind === "text")
    .map((t) => t.text)
    .join("");
}

/** Reads a number as the report prints it (thousands commas, U+2212 minus). */
export function parseShown(text: string): number {
  return Number(
    text
      .replace(/,/g, "")
      .replace(/\u2212/g, "-")
      .trim(),
  );
}
