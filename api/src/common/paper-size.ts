import measurementData from 'cldr-core/supplemental/measurementData.json';

export type PaperSize = 'LETTER' | 'A4';

/**
 * The paper a shop's printer holds, from its country: Unicode CLDR supplemental data,
 * `measurementData.paperSize` (the `cldr-core` package), which lists the US-Letter territories
 * (US, CA, MX, the Philippines, Chile, Colombia, Venezuela and others) and A4 for the rest of the
 * world ("001"). The names are pdfkit's page sizes.
 */
const paperSizes = (measurementData as { supplemental: { measurementData: { paperSize: Record<string, string> } } }).supplemental
  .measurementData.paperSize;

export function paperSizeFor(countryCode: string | null | undefined): PaperSize {
  const size = paperSizes[(countryCode ?? '').trim().toUpperCase()] ?? paperSizes['001'];
  return size === 'US-Letter' ? 'LETTER' : 'A4';
}
