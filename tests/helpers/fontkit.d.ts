/** The part of fontkit (pdfkit's own font reader) the report tests use to check glyph coverage. */
declare module 'fontkit' {
  const fontkit: { openSync(path: string): { hasGlyphForCodePoint(codePoint: number): boolean } };
  export default fontkit;
}
