import { Children, type ReactNode } from "react";
// biome-ignore lint/style/noRestrictedImports: this module is the wrapper every other document uses
import { Text as PdfText, View, type TextProps as PdfTextProps } from "@react-pdf/renderer";
import type { Style } from "@react-pdf/types";
import { createRequire } from "node:module";
import * as fontkit from "fontkit";
import { s as theme } from "./theme.ts";

/**
 * Every document's text goes through this <Text>, so every glyph comes from the embedded Libre
 * Franklin. react-pdf sets any character its font lacks — a typed line break, ✕, ✓, → — in its
 * built-in Helvetica, which is not embedded (or prints nothing). Here:
 *   - a string with line breaks is set a line at a time (one text block per line);
 *   - a character the font lacks becomes its compatibility form when the font has that (⅛ → 1⁄8),
 *     a plain equivalent from the table below, or "?" as a last resort.
 * scripts/check-imports.ts keeps documents from importing react-pdf's own Text.
 */
const require = createRequire(import.meta.url);
const FONT_FILE = require.resolve("@fontsource/libre-franklin/files/libre-franklin-latin-400-normal.woff");
// The three weights are cut from the same character set (checked in tests/unit/pdf-text.test.ts).
const font = fontkit.openSync(FONT_FILE);

const PLAIN: Record<string, string> = {
  "✕": "×",
  "✖": "×",
  "✗": "×",
  "✘": "×",
  "❌": "×",
  "✓": "yes",
  "✔": "yes",
  "☑": "yes",
  "▲": "!",
  "△": "!",
  "⚠": "!",
  "→": "to",
  "⟶": "to",
  "←": "from",
  "≤": "<=",
  "≥": ">=",
  "≈": "about",
  "√": "yes",
  "\t": " ",
};

const seen = new Map<number, boolean>();
function has(cp: number): boolean {
  let v = seen.get(cp);
  if (v === undefined) {
    v = font.hasGlyphForCodePoint(cp);
    seen.set(cp, v);
  }
  return v;
}

/** The text with every character the font lacks replaced; line breaks are kept for the caller to split. */
export function fontSafe(text: string): string {
  let out = "";
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (ch === "\n" || has(cp)) {
      out += ch;
      continue;
    }
    if (ch === "\r") continue;
    const plain = PLAIN[ch];
    if (plain !== undefined) {
      out += plain;
      continue;
    }
    const compat = ch.normalize("NFKC");
    if (compat !== ch && [...compat].every((c) => has(c.codePointAt(0)!))) out += compat;
    else if (/\p{Mn}/u.test(ch))
      continue; // a combining mark the font lacks: the letter stands alone
    else out += "?";
  }
  return out;
}

type TextProps = PdfTextProps & { children?: ReactNode };

function clean(children: ReactNode): ReactNode {
  return Children.map(children, (c) => (typeof c === "string" ? fontSafe(c) : c));
}

/** All string children joined, when the children are only strings and numbers; null otherwise. */
function plainText(children: ReactNode): string | null {
  let s = "";
  for (const c of Children.toArray(children)) {
    if (typeof c === "string" || typeof c === "number") s += String(c);
    else return null;
  }
  return s;
}

/** How much of what follows a heading must fit under it on the same page, in points (about four lines of body text). */
export const HEADING_PRESENCE = 56;
const isHeading = (style: TextProps["style"]) => style === theme.h1 || style === theme.h2 || (Array.isArray(style) && (style.includes(theme.h2) || style.includes(theme.h1)));

export function Text(props: TextProps) {
  const { children, style, ...given } = props;
  if (props.render) return <PdfText {...props} />;
  // A heading never ends a page: it keeps the start of its section with it.
  const rest = isHeading(style) && given.minPresenceAhead === undefined ? { ...given, minPresenceAhead: HEADING_PRESENCE } : given;
  const plain = plainText(children);
  if (plain !== null && /\r?\n/.test(plain)) {
    const lines = fontSafe(plain).split("\n");
    // A block of lines: the style (font, size, colour, margins) sits on the block, which the lines inherit.
    return (
      <View style={style as Style} {...(rest.wrap !== undefined ? { wrap: rest.wrap } : {})}>
        {lines.map((l, i) => (
          <PdfText key={i} {...rest}>
            {l === "" ? " " : l}
          </PdfText>
        ))}
      </View>
    );
  }
  return (
    <PdfText style={style} {...rest}>
      {clean(children)}
    </PdfText>
  );
}
