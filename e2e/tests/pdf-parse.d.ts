// pdf-parse 1.x ships no types; this is the part of its API the tests use.
declare module 'pdf-parse/lib/pdf-parse.js' {
  function pdfParse(data: Buffer): Promise<{ text: string; numpages: number; info: Record<string, unknown> }>;
  export default pdfParse;
}
