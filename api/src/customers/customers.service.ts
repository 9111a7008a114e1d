import { Injectable, NotFoundException } from '@nestjs/common';
import type { AuthUser, CustomerDetail, CustomerPage, CustomerSummary } from '@loomwright/shared';
import { Database } from '../database/database';
import { CustomersRepository } from './customers.repository';
import type { ListCustomersQuery } from '@loomwright/shared';

// Generated<Timestamp> columns come back typed as the column type; at runtime pg gives a Date.
const iso = (d: unknown) => (d instanceof Date ? d : new Date(String(d))).toISOString();
const isoOrNull = (d: unknown) => (d ? iso(d) : null);

type SummaryRow = NonNullable<Awaited<ReturnType<CustomersRepository['summary']>>>;

@Injectable()
export class CustomersService {
  constructor(
    private readonly db: Database,
    private readonly customers: CustomersRepository,
  ) {}

  /**
   * Customers as `viewer` may see them: the owner sees every address; a builder sees the e-mail
   * and phone of customers with a build assigned to them, and only the name of everyone else (and
   * so searches and sorts by name, not by an address they cannot see).
   */
  async list(viewer: AuthUser, query: ListCustomersQuery): Promise<CustomerPage> {
    const owner = viewer.role === 'owner';
    const { rows, total } = await this.customers.page(this.db, viewer.id, {
      ...query,
      sort: !owner && query.sort === 'email' ? 'name' : query.sort,
      searchEmail: owner,
    });
    return { items: rows.map((r) => this.toSummary(r, viewer)), total, page: query.page, pageSize: query.pageSize };
  }

  async detail(viewer: AuthUser, id: string): Promise<CustomerDetail> {
    const row = await this.customers.summary(this.db, viewer.id, id);
    if (!row) throw new NotFoundException('There is no customer with that id.');
    const seesContact = this.seesContact(row, viewer);
    const [builds, payments, messages] = await Promise.all([
      this.customers.builds(this.db, id),
      this.customers.payments(this.db, id),
      this.customers.messages(this.db, id, row.email),
    ]);
    return {
      ...this.toSummary(row, viewer),
      builds: builds.map((b) => ({
        id: b.id,
        reference: b.reference,
        state: b.state,
        benchDate: b.bench_date,
        createdAt: iso(b.created_at),
      })),
      payments: payments.map((p) => ({
        id: p.id,
        bookingId: p.booking_id,
        reference: p.reference,
        kind: p.kind,
        amount: p.amount,
        currency: p.currency.trim(),
        status: p.status,
        paidAt: isoOrNull(p.paid_at),
        createdAt: iso(p.created_at),
      })),
      messages: messages.map((m) => ({
        id: m.id,
        template: m.template,
        subject: m.subject,
        toAddress: seesContact ? m.to_address : null,
        state: m.state,
        bookingId: m.booking_id,
        createdAt: iso(m.created_at),
        sentAt: isoOrNull(m.sent_at),
      })),
    };
  }

  private seesContact(r: SummaryRow, viewer: AuthUser): boolean {
    return viewer.role === 'owner' || r.builds_of_viewer;
  }

  private toSummary(r: SummaryRow, viewer: AuthUser): CustomerSummary {
    const seesContact = this.seesContact(r, viewer);
    return {
      id: r.id,
      name: r.name,
      email: seesContact ? r.email : null,
      phone: seesContact ? r.phone : null,
      createdAt: iso(r.created_at),
      buildCount: Number(r.build_count),
      activeBuildCount: Number(r.active_build_count),
      lastBookingAt: isoOrNull(r.last_booking_at),
    };
  }
}
