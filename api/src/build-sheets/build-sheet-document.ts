import fs from 'node:fs';
import path from 'node:path';
import {
  moneyAccount,
  shopFormat,
  type EstimateResult,
  type FunctionItem,
  type MoneyFacts,
  type QuoteView,
  type RigChecks,
  type RigConfiguration,
  type ShopFormat,
} from '@loomwright/shared';
import type { PaperSize } from '../common/paper-size';
import PDFDocument from 'pdfkit';

/** Everything one sheet prints, gathered by the service. */
export interface BuildSheetData {
  shopName: string;
  /** The shop's postal address on one line (Settings), where the board goes back from; null until set. */
  shopAddress: string | null;
  reference: string;
  stateLabel: string;
  customer: string;
  /** The booking's money: its facts from moneyFacts(), the quote it is priced on, its extras, and the shop's formats. */
  money: {
    facts: MoneyFacts;
    quote: QuoteView;
    extras: Array<{ description: string; amount: string; status: 'proposed' | 'approved' | 'declined' }>;
    format: ShopFormat;
  };
  builder: string | null;
  benchDate: string | null;
  expectedCompletion: string | null;
  configuration: RigConfiguration;
  customerNotes: string;
  estimate: EstimateResult;
  checks: RigChecks;
  functions: FunctionItem[];
  surfaceName: string;
  caseName: string;
  printedAt: Date;
  /** The shop's locale, currency and time zone: every figure, day and moment on the sheet. */
  format?: ShopFormat;
  /** Letter or A4, from the shop's country (`paperSizeFor`). */
  paper?: PaperSize;
}

/** The bench cautions every sheet carries, whatever the rig (defer to local codes and licensed practice). */
export const benchCautions = [
  'Mains power: the supply plugs into the mains. Any mains wiring, power inlet or mains lead is work only for a qualified person, under your local electrical codes. Never open a mains-powered supply.',
  "Voltage and polarity: check every pedal's voltage and barrel polarity against its label before it is powered; a wrong voltage or a centre-positive plug on a centre-negative pedal can destroy it.",
  'Heavy cases: a loaded road case or large board needs a two-person lift.',
  'Soldering: work in a ventilated place with fume extraction; solder may contain lead, so wash your hands after handling it and keep food and drink off the bench. Wear eye protection when trimming leads.',
];

const ASSET_CANDIDATES = [
  path.resolve(__dirname, '..', '..', 'assets', 'fonts'), // api/src/build-sheets (tests)
  path.resolve(__dirname, '..', '..', '..', 'assets', 'fonts'), // api/dist/src/build-sheets (built)
];

function fontsDir(): string {
  const dir = ASSET_CANDIDATES.find((d) => fs.existsSync(path.join(d, 'manrope-latin-400-normal.woff')));
  if (!dir) throw new Error('The build sheet fonts are missing from api/assets/fonts');
  return dir;
}

export const MARGIN = 48;

/** A small table writer over pdfkit: rows wrap within their columns and break pages cleanly. */
export class Sheet {
  readonly doc: PDFKit.PDFDocument;

  constructor(title: string, paper: PaperSize = 'A4') {
    const fonts = fontsDir();
    this.doc = new PDFDocument({ size: paper, margin: MARGIN, info: { Title: title, Creator: 'Loomwright' }, bufferPages: true });
    this.doc.registerFont('body', path.join(fonts, 'manrope-latin-400-normal.woff'));
    this.doc.registerFont('bold', path.join(fonts, 'manrope-latin-700-normal.woff'));
    this.doc.font('body').fontSize(9.5);
  }

  get width() {
    return this.doc.page.width - MARGIN * 2;
  }

  private ensureRoom(height: number) {
    if (this.doc.y + height > this.doc.page.height - MARGIN) this.doc.addPage();
  }

  heading(text: string) {
    // A heading keeps at least its first table rows with it.
    this.ensureRoom(90);
    this.doc.moveDown(0.8).font('bold').fontSize(12.5).text(text, MARGIN, this.doc.y).font('body').fontSize(9.5).moveDown(0.3);
  }

  paragraph(text: string, options: { bold?: boolean } = {}) {
    this.ensureRoom(this.doc.heightOfString(text, { width: this.width }) + 4);
    this.doc
      .font(options.bold ? 'bold' : 'body')
      .text(text, MARGIN, this.doc.y, { width: this.width })
      .font('body');
  }

  bullets(items: string[]) {
    for (const item of items) {
      const h = this.doc.heightOfString(item, { width: this.width - 14 });
      this.ensureRoom(h + 3);
      const y = this.doc.y;
      this.doc
        .text('•', MARGIN, y)
        .text(item, MARGIN + 14, y, { width: this.width - 14 })
        .moveDown(0.2);
    }
  }

  /** widths are fractions of the text width. */
  table(headers: string[], rows: string[][], widths: number[]) {
    const cols = widths.map((w) => w * this.width);
    const draw = (cells: string[], bold: boolean) => {
      this.doc.font(bold ? 'bold' : 'body');
      const height = Math.max(...cells.map((c, i) => this.doc.heightOfString(c, { width: cols[i] - 6 }))) + 4;
      this.ensureRoom(height);
      const y = this.doc.y;
      let x = MARGIN;
      cells.forEach((c, i) => {
        this.doc.text(c, x, y, { width: cols[i] - 6 });
        x += cols[i];
      });
      this.doc.y = y + height;
      this.doc.font('body');
    };
    draw(headers, true);
    this.doc
      .moveTo(MARGIN, this.doc.y - 2)
      .lineTo(MARGIN + this.width, this.doc.y - 2)
      .lineWidth(0.5)
      .stroke();
    for (const row of rows) draw(row, false);
  }

  /** The row layout, scaled to the page: outlines only, so it prints on any printer. */
  layout(checks: RigChecks) {
    const fit = checks.boardFit;
    const scale = Math.min(this.width / fit.usableWidthMm, 220 / fit.usableDepthMm);
    const h = fit.usableDepthMm * scale;
    this.ensureRoom(h + 24);
    const top = this.doc.y + 4;
    this.doc
      .lineWidth(1)
      .rect(MARGIN, top, fit.usableWidthMm * scale, h)
      .stroke();
    this.doc.fontSize(6.5);
    this.doc.fontSize(8);
    for (const p of fit.layout) {
      const rect = this.doc.lineWidth(0.5).rect(MARGIN + p.x * scale, top + p.y * scale, p.widthMm * scale, p.depthMm * scale);
      if (p.group === 'loop') rect.dash(3, { space: 2 }).stroke().undash();
      else rect.stroke();
      this.doc.text(`${p.number}`, MARGIN + p.x * scale + 2, top + p.y * scale + 2, { width: p.widthMm * scale - 4, lineBreak: false });
    }
    this.doc.fontSize(9.5);
    this.doc.y = top + h + 6;
    const key = [...fit.layout].sort((a, b) => a.number - b.number);
    this.paragraph(
      `Top view, the player's side at the bottom; signal in at the right, out at the left; dashed outlines are switcher loops. ${key.map((p) => `${p.number} ${p.device}`).join(' · ')}`,
    );
  }

  footer(text: string) {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      const bottom = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0;
      this.doc.fontSize(7.5).text(`${text} · page ${i + 1} of ${range.count}`, MARGIN, this.doc.page.height - MARGIN / 2 - 6, {
        width: this.width,
        lineBreak: false,
      });
      this.doc.page.margins.bottom = bottom;
    }
  }
}

const ma = (n: number) => `${n} mA`;
const polarity = (p: string) => (p === 'center_positive' ? 'centre +' : 'centre −');

const extraWords = { proposed: 'waiting for the player', approved: 'approved', declined: 'declined' } as const;

/**
 * The money section: the quote's lines (a firm quote's labor at the builder's one rate, so the
 * lines add up to its total), the extras with their answers, and the account from moneyAccount()
 * over the booking's moneyFacts(): the same lines, in the same words, as both apps show.
 */
function writeMoney(sheet: Sheet, money: BuildSheetData['money']) {
  const { facts, quote, extras, format } = money;
  const cur = facts.currency;
  sheet.heading('Money');
  sheet.table(
    [quote.kind === 'firm' ? 'Firm quote' : 'Estimate (no firm quote yet)', 'Quantity', 'Amount'],
    quote.lines.map((l) => [
      `${l.label}${l.explanation ? ` (${l.explanation})` : ''}`,
      `${l.quantity} ${l.unit}`,
      l.amountHigh && l.amountHigh !== l.amount ? format.moneyRange(l.amount, l.amountHigh, cur) : format.money(l.amount, cur),
    ]),
    [0.6, 0.15, 0.25],
  );
  sheet.paragraph(
    quote.kind === 'firm' && quote.total !== null
      ? `Firm total ${format.money(quote.total, cur)} (${format.hours(quote.laborHours)} at ${format.perHour(quote.hourlyRate, cur)}).`
      : `Estimated total ${format.moneyRange(quote.totalLow, quote.totalHigh, cur)}.`,
    { bold: true },
  );
  if (extras.length) {
    sheet.table(
      ['Extra', 'Answer', 'Amount'],
      extras.map((e) => [e.description, extraWords[e.status], format.money(e.amount, cur)]),
      [0.6, 0.2, 0.2],
    );
  }
  const account = moneyAccount(facts, (amount, currency) => format.money(amount, currency));
  sheet.table(
    ['Account', 'When', 'Amount'],
    account.rows.map((r) => [r.label, r.at ? format.dateTime(r.at) : '', format.money(r.amount, cur)]),
    [0.45, 0.35, 0.2],
  );
  if (account.notes.length) sheet.bullets(account.notes);
}

/** Renders the sheet to a PDF buffer. */
export function renderBuildSheet(data: BuildSheetData): Promise<Buffer> {
  const sheet = new Sheet(`Build sheet ${data.reference}`, data.paper);
  const { doc } = sheet;
  const f = data.format ?? shopFormat();
  const watts = (n: number | null) => (n === null ? '—' : `${f.quantity(n)} W`);
  const day = (d: string) => f.day(d, { year: 'always' });
  const fmtHours = (h: string | number) => f.hours(h);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const { checks, estimate } = data;
  const chain = checks.signalChain;
  const byId = new Map(chain.devices.map((d) => [d.id, d]));

  doc.font('bold').fontSize(17).text(`Build sheet ${data.reference}`, MARGIN, MARGIN);
  doc
    .font('body')
    .fontSize(9.5)
    .text(data.shopAddress ? `${data.shopName} · ${data.shopAddress}` : data.shopName);
  doc.moveDown(0.4);
  sheet.table(
    ['Customer', 'Builder', 'Bench date', 'Status'],
    [
      [
        data.customer,
        data.builder ?? 'not assigned yet',
        data.benchDate ? `${day(data.benchDate)}${data.expectedCompletion ? ` (done by ${day(data.expectedCompletion)})` : ''}` : 'not set',
        data.stateLabel,
      ],
    ],
    [0.3, 0.25, 0.25, 0.2],
  );
  sheet.paragraph(
    `${data.surfaceName} · ${data.caseName} · ${chain.routing === 'switcher' ? `switcher, ${chain.loops.length} loops` : 'serial'} · ${f.hours(estimate.laborHours)} estimated · needs at least a ${estimate.minimumLevel} builder · price book version ${estimate.priceBookVersion}`,
  );

  sheet.heading('Bench safety');
  sheet.bullets(benchCautions);

  sheet.heading('Signal chain');
  // The same numbers as the layout drawing and the cable schedule: the loops follow the switcher.
  const chainLines = chain.main.map((id) => {
    const d = byId.get(id)!;
    return `${d.number}. ${d.name}${id === chain.switcherId ? ` (loops ${chain.loops.length ? `1–${chain.loops.length}: ${chain.loops.map((l) => byId.get(l.deviceId)!.number).join(', ')}` : 'none'})` : ''}`;
  });
  sheet.paragraph(`Guitar in, then ${chainLines.join(', then ')}, then out to the amp.`);

  if (chain.routing === 'switcher') {
    sheet.heading('Loop assignments');
    sheet.table(
      ['Loop', 'Pedal', 'Supply'],
      chain.loops.map(({ loop, deviceId }) => {
        const d = byId.get(deviceId)!;
        return [
          String(loop),
          `${d.number} ${d.name}`,
          d.powered ? `${d.voltage} V, ${ma(d.budgetMa)}${d.drawFromMemory ? ' (assumed)' : ''}` : 'passive',
        ];
      }),
      [0.1, 0.55, 0.35],
    );
  }

  sheet.heading('Power assignment');
  const power = checks.powerBudget;
  if (power.supplyListed) {
    sheet.table(
      ['Output', 'Rating', 'Load', 'Headroom', 'Pedals', 'Flags'],
      power.outputs.map((o) => [
        `${o.label} (${o.voltage} V ${o.supply.toUpperCase()}${o.isolated ? ', isolated' : ''})`,
        `${ma(o.ratingMa)} / ${watts(o.ratingW)}`,
        `${ma(o.loadMa)} / ${watts(o.loadW)}`,
        `${ma(o.headroomMa)} / ${watts(o.headroomW)}`,
        o.devices.join(', ') || '—',
        o.flags.join(' ') || 'ok',
      ]),
      [0.18, 0.14, 0.14, 0.14, 0.2, 0.2],
    );
    sheet.paragraph(
      `Total: ${ma(power.totalDrawMa)} drawn of ${ma(power.totalRatingMa ?? 0)} rated; headroom ${ma(power.totalHeadroomMa ?? 0)} (${watts(power.totalHeadroomW)}).`,
    );
  } else {
    sheet.table(
      ['Pedal', 'Voltage', 'Draw'],
      power.assignments.map((a) => [a.device, `${a.voltage} V`, `${ma(a.currentMa)}${a.drawFromMemory ? ' (assumed, typical)' : ''}`]),
      [0.5, 0.2, 0.3],
    );
    sheet.paragraph(
      `No supply listed: ${ma(power.totalDrawMa)} (${watts(power.totalDrawW)}) in all. Check the customer's supply at intake.`,
    );
  }
  if (power.fixes.length) sheet.bullets(power.fixes.map((f) => `To fix: ${f}`));
  if (power.warnings.length) sheet.bullets(power.warnings);

  sheet.heading('Cable schedule');
  const cables = checks.cableSchedule;
  sheet.table(
    ['#', 'From', 'To', 'Length', 'Spare', 'Plugs'],
    cables.patches.map((c) => [
      String(c.number),
      c.fromDevice === null ? c.from : `${c.fromDevice} ${c.from}`,
      c.toDevice === null ? c.to : `${c.toDevice} ${c.to}`,
      `${c.lengthFeet} ft`,
      `${c.spareFeet} ft`,
      String(c.plugs),
    ]),
    [0.05, 0.33, 0.33, 0.1, 0.1, 0.09],
  );
  sheet.paragraph(
    `${cables.patchCount} patch cables, ${cables.plugCount} plugs, ${cables.cableFeet} ft of cable including ${cables.spareFeet} ft spare.`,
    { bold: true },
  );
  sheet.paragraph(`Power leads: ${cables.barrelPlugCount} DC barrel plugs.`);
  sheet.table(
    ['Power lead for', 'Voltage', 'Polarity', 'Connector'],
    cables.powerLeads.map((l) => [l.device, `${l.voltage} V ${l.supply.toUpperCase()}`, polarity(l.polarity), l.connector]),
    [0.4, 0.15, 0.15, 0.3],
  );

  sheet.heading('Functions');
  if (data.functions.length === 0) sheet.paragraph('None.');
  else
    sheet.bullets(
      data.functions.map(
        (f) => `${f.name}: ${fmtHours(f.laborHours)}${f.functionCount > 1 ? ` (counts as ${f.functionCount})` : ''}. ${f.description}`,
      ),
    );

  sheet.heading('Layout');
  sheet.paragraph(
    `${data.surfaceName}, ${checks.boardFit.usableWidthMm} × ${checks.boardFit.usableDepthMm} mm usable, ${Math.round(checks.boardFit.fillRatio * 100)}% filled with ${checks.boardFit.spacingMm} mm spacing.`,
  );
  if (checks.boardFit.warnings.length) sheet.bullets(checks.boardFit.warnings);
  if (checks.boardFit.layout.length) sheet.layout(checks);

  writeMoney(sheet, data.money);

  sheet.heading("Customer's notes");
  sheet.paragraph(data.customerNotes.trim() || 'No notes.');

  sheet.footer(`${data.shopName} · ${data.reference} · printed ${f.dateTime(data.printedAt)}`);
  doc.end();
  return done;
}
