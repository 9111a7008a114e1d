import { shopFormat, type Catalog, type EstimateResult, type PriceBook, type RigConfiguration, type ShopFormat } from '@loomwright/shared';
import { benchCautions, MARGIN, Sheet } from '../build-sheets/build-sheet-document';
import type { PaperSize } from '../common/paper-size';

export interface QuoteData {
  shopName: string;
  configuration: RigConfiguration;
  estimate: EstimateResult;
  book: PriceBook | Catalog;
  /** The quote's own title: a saved configuration's name, or "Quote". */
  title: string;
  printedAt: Date;
  /** A booking's firm price, once a builder with a known rate accepted it. */
  firm?: { total: string; hourlyRate: string };
  /** The shop's locale, currency and time zone. */
  format?: ShopFormat;
  /** Letter or A4, from the shop's country. */
  paper?: PaperSize;
}

/** The quote the player keeps: lines, totals at the chosen level, layout, power plan, cable list and cautions. */
export function renderQuote(data: QuoteData): Promise<Buffer> {
  const sheet = new Sheet(`${data.title} — quote`, data.paper);
  const { doc } = sheet;
  const f = data.format ?? shopFormat();
  const money = (amount: string, currency: string) => f.money(amount, currency);
  const range = (low: string, high: string, currency: string) => f.moneyRange(low, high, currency);
  const watts = (n: number | null) => (n === null ? '—' : `${f.quantity(n)} W`);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const { estimate: e, configuration: config, book } = data;
  const checks = e.checks!;
  const cur = e.currency;
  const surface = book.surfaces.find((s) => s.id === config.surfaceId);
  const rigCase = book.cases.find((c) => c.id === config.caseId);
  const level = book.levels.find((l) => l.code === e.level);
  // The day in the shop's own calendar, not UTC's.
  const date = f.dayOf(data.printedAt, { year: 'always' });

  doc.font('bold').fontSize(17).text(`${data.title}`, MARGIN, MARGIN);
  doc.font('body').fontSize(9.5).text(`${data.shopName} · quote dated ${date} · price book version ${e.priceBookVersion}`);
  doc.moveDown(0.4);
  sheet.paragraph(
    `${surface?.name ?? config.surfaceId} · ${rigCase?.name ?? config.caseId} · ${config.routing.mode === 'switcher' ? `loop switcher, ${checks.signalChain.loops.length} loops` : 'serial'} · ${f.hours(e.laborHours)} of bench time · ${level?.name ?? e.level} builder`,
  );

  sheet.heading('Estimate');
  sheet.table(
    ['Item', 'Quantity', 'Amount'],
    e.lines.map((l) => [
      `${l.label}${l.explanation ? ` (${l.explanation})` : ''}`,
      `${f.quantity(l.quantity)} ${l.unit}`,
      l.kind === 'labor' ? range(l.amount, l.amountHigh ?? l.amount, cur) : money(l.amount, cur),
    ]),
    [0.6, 0.15, 0.25],
  );
  sheet.paragraph(`Materials: ${money(e.materialsTotal, cur)}`);
  sheet.paragraph(
    `Labor at ${level?.name ?? e.level} rates (${f.perHourRange(e.rate.low, e.rate.high, cur)}): ${range(e.laborLow, e.laborHigh, cur)}`,
  );
  sheet.paragraph(`Estimated total: ${range(e.totalLow, e.totalHigh, cur)}`, { bold: true });
  if (data.firm)
    sheet.paragraph(`Firm price set by the shop: ${money(data.firm.total, cur)} (labor at ${money(data.firm.hourlyRate, cur)} an hour)`, {
      bold: true,
    });
  sheet.paragraph(`Deposit to book bench time: ${money(e.deposit, cur)}. ${book.depositPolicy.description}`);
  sheet.paragraph(
    'A range, because the rate depends on the builder who takes it; the shop confirms a firm price when it accepts. Pedals, power supply and switcher are yours to supply.',
  );

  sheet.heading('Layout');
  const fit = checks.boardFit;
  if (fit.layout.length) sheet.layout(checks);
  if (fit.warnings.length) sheet.bullets(fit.warnings);

  sheet.heading('Power plan');
  const power = checks.powerBudget;
  if (power.supplyListed) {
    sheet.table(
      ['Output', 'Rating', 'Load', 'Feeds'],
      power.outputs.map((o) => [
        `${o.label} (${o.voltage} V ${o.supply.toUpperCase()}${o.isolated ? ', isolated' : ''})`,
        `${o.ratingMa} mA / ${watts(o.ratingW)}`,
        `${o.loadMa} mA / ${watts(o.loadW)}`,
        o.devices.join(', ') || 'free',
      ]),
      [0.3, 0.18, 0.18, 0.34],
    );
  }
  sheet.paragraph(`The pedals draw ${power.totalDrawMa} mA in all (${watts(power.totalDrawW)}).`);
  if (power.fixes.length) sheet.bullets(power.fixes.map((f) => `To fix: ${f}`));
  if (power.warnings.length) sheet.bullets(power.warnings);

  sheet.heading('Patch cables');
  const cables = checks.cableSchedule;
  sheet.table(
    ['#', 'From', 'To', 'Length', 'Purpose'],
    cables.patches.map((c) => [
      String(c.number),
      c.fromDevice === null ? c.from : `${c.fromDevice} ${c.from}`,
      c.toDevice === null ? c.to : `${c.toDevice} ${c.to}`,
      `${c.lengthFeet} ft`,
      c.purpose.replace('_', ' '),
    ]),
    [0.06, 0.34, 0.34, 0.1, 0.16],
  );
  sheet.paragraph(
    `${cables.patchCount} patch cables, ${cables.plugCount} plugs, ${cables.cableFeet} ft of cable including ${cables.spareFeet} ft spare; ${cables.barrelPlugCount} power leads.`,
  );

  sheet.heading('Notes and cautions');
  sheet.bullets([...e.notes, ...benchCautions]);

  sheet.footer(`${data.shopName} · quote of ${date} · price book version ${e.priceBookVersion}`);
  doc.end();
  return done;
}
