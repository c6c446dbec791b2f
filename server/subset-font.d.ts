// subset-font ships no types; the one call `npm run fonts` makes (see its README).
declare module 'subset-font' {
  export default function subsetFont(
    font: Buffer,
    text: string,
    options?: {
      targetFormat?: 'woff2' | 'woff' | 'truetype' | 'sfnt';
      noHinting?: boolean;
      keepFeatures?: string[];
    },
  ): Promise<Buffer>;
}
