// Limits checked before any Markdown is parsed. The parser and the HTML tree walkers recurse
// once per level of nesting, so a few thousand nested quotes or list markers overflowed the
// stack (a 500, and a species page that could not be shown). No club note or care text needs
// more than a handful of levels.

/** Deepest nesting of block quotes, list items and brackets that is accepted. */
export const MAX_MARKDOWN_DEPTH = 32;
/** Longest source the renderer parses at all (a meeting note is capped lower on save). */
const MAX_MARKDOWN_CHARS = 200_000;

const FENCE = /^ {0,3}(`{3,}|~{3,})/;
const LIST_MARKER = /^(?:[-*+]|\d{1,9}[.)])(?=[ \t]|$)/;

/**
 * The deepest nesting in a Markdown source, counted without parsing: per line, the block quote
 * markers, list markers and indentation steps before the text, and across the text, the depth of
 * unclosed brackets and parentheses. Lines inside fenced code do not count.
 */
export function markdownDepth(source: string): number {
  let max = 0;
  let fence: string | null = null;
  let bracket = 0;
  let lineStart = 0;
  while (lineStart <= source.length) {
    let end = source.indexOf('\n', lineStart);
    if (end === -1) end = source.length;
    const line = source.slice(lineStart, end);
    lineStart = end + 1;
    const f = FENCE.exec(line);
    if (fence) {
      if (f && f[1][0] === fence[0] && f[1].length >= fence.length) fence = null;
      continue;
    }
    if (f) {
      fence = f[1];
      continue;
    }
    let depth = 0;
    let i = 0;
    for (;;) {
      let spaces = 0;
      while (i < line.length && (line[i] === ' ' || line[i] === '\t')) spaces += line[i++] === '\t' ? 4 : 1;
      depth += Math.floor(spaces / 2);
      if (line[i] === '>') {
        depth++;
        i++;
        continue;
      }
      const m = LIST_MARKER.exec(line.slice(i, i + 12));
      if (m) {
        depth++;
        i += m[0].length;
        continue;
      }
      break;
    }
    for (; i < line.length; i++) {
      const c = line[i];
      if (c === '\\') i++;
      else if (c === '[' || c === '(') max = Math.max(max, ++bracket);
      else if ((c === ']' || c === ')') && bracket > 0) bracket--;
    }
    if (line.trim() === '') bracket = 0;
    if (depth > max) max = depth;
    if (end === source.length) break;
  }
  return max;
}

/** Why a source cannot be saved, or null when it is within the limits. */
export function markdownProblem(source: string, maxChars = MAX_MARKDOWN_CHARS): string | null {
  if (source.length > maxChars) return `Keep the text under ${maxChars.toLocaleString('en')} characters.`;
  if (markdownDepth(source) > MAX_MARKDOWN_DEPTH) {
    return `Quotes, lists and brackets are nested too deeply: keep them under ${MAX_MARKDOWN_DEPTH} levels.`;
  }
  return null;
}
