// The one part of fontkit (the font reader react-pdf uses) that server/lib/pdf/text.tsx needs.
declare module "fontkit" {
  export function openSync(path: string): { hasGlyphForCodePoint(codePoint: number): boolean };
}
