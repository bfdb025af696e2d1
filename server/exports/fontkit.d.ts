// fontkit ships no types; the PDF report only asks a face which glyphs it has.
declare module 'fontkit' {
  export function create(buffer: Buffer | Uint8Array, postscriptName?: string): unknown;
}
