import { Injectable } from '@nestjs/common';
import { exportColumns, type DateRangeQuery, type ExportKind } from '@loomwright/shared';
import { bookingMoney, type OfficeBookingRow } from './booking-money';
import { isoInTimeZone, textCell } from './csv-cells';
import { OfficeRepository, STREAM_CHUNK, type ShopRange } from './office.repository';

type Cell = string;

/** One CSV: its file name, its header row and its rows, read from the database as they are written out. */
export interface CsvExport {
  fileName: string;
  columns: readonly string[];
  rows: AsyncIterable<Cell[]>;
}

/**
 * The bookkeeper's CSV files. Each row is built from one streamed database row, so memory holds a
 * cursor's chunk, never the whole range; money is a decimal string (never a float), times are
 * ISO 8601 on the shop's clock, calendar days stay YYYY-MM-DD.
 */
@Injectable()
export class ExportsService {
  constructor(private readonly office: OfficeRepository) {}

  async open(kind: ExportKind, query: DateRangeQuery): Promise<CsvExport> {
    const shop = await this.office.shop();
    const range: ShopRange = { from: query.from, to: query.to, timeZone: shop.timezone };
    const fileName = `${kind}-${query.from}-to-${query.to}.csv`;
    const rows =
      kind === 'bookings'
        ? this.bookingRows(range, shop.currency.trim())
        : kind === 'payments'
          ? this.paymentRows(range)
          : this.hourRows(range);
    return { fileName, columns: exportColumns[kind], rows };
  }

  /** One booking's row; the money columns come from moneyFacts, the one place the API computes them. */
  static bookingCells(b: OfficeBookingRow, timeZone: string, shopCurrency: string): Cell[] {
    const { currency, money } = bookingMoney(b, shopCurrency);
    return [
      b.reference,
      isoInTimeZone(b.created_at, timeZone),
      b.state,
      textCell(b.customer_name),
      textCell(b.customer_email),
      textCell(b.builder_name),
      b.builder_level ?? '',
      b.bench_date ?? '',
      b.expected_completion ?? '',
      currency,
      b.estimate?.total_low ?? '',
      b.estimate?.total_high ?? '',
      b.estimate?.deposit ?? '',
      money.firmTotal ?? '',
      money.approvedExtras,
      money.totalOwed ?? '',
      money.paid,
      money.refunded,
      money.netPaid,
      money.balanceDue ?? '',
      (b.firm ?? b.estimate)?.labor_hours ?? '',
      b.recorded_hours,
    ];
  }

  private async *bookingRows(range: ShopRange, shopCurrency: string): AsyncIterable<Cell[]> {
    for await (const b of this.office.bookingsQuery(range).stream(STREAM_CHUNK)) {
      yield ExportsService.bookingCells(b, range.timeZone, shopCurrency);
    }
  }

  private async *paymentRows(range: ShopRange): AsyncIterable<Cell[]> {
    for await (const m of this.office.moneyMovementsQuery(range).stream(STREAM_CHUNK)) {
      yield [
        isoInTimeZone(m.at, range.timeZone),
        m.entry,
        m.payment_kind,
        m.amount,
        m.currency,
        m.method,
        m.reference,
        textCell(m.customer_name),
        textCell(m.customer_email),
        m.payment_id,
        m.provider_payment ?? '',
        m.provider_refund ?? '',
      ];
    }
  }

  private async *hourRows(range: ShopRange): AsyncIterable<Cell[]> {
    for await (const t of this.office.hoursQuery(range).stream(STREAM_CHUNK)) {
      yield [
        t.worked_on,
        t.reference,
        textCell(t.builder_name),
        t.builder_level,
        t.hours,
        textCell(t.note),
        textCell(t.recorded_by),
        isoInTimeZone(t.created_at, range.timeZone),
      ];
    }
  }
}
