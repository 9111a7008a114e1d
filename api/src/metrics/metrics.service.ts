import { Injectable } from '@nestjs/common';
import { Pool } from 'pg';
import { collectDefaultMetrics, Counter, Gauge, Histogram, Registry } from 'prom-client';
import { MailOutboxRepository } from '../mail/mail-outbox.repository';
import { PaymentsRepository } from '../payments/payments.repository';
import { MetricsRepository } from './metrics.repository';

/**
 * The process's Prometheus metrics (prom-client, text exposition format). Request counts and
 * latency are counted here as answers go out; the rest is read when scraped: the pool from pg,
 * and the job queue, mail and payments from PostgreSQL, so every replica reports the same shared
 * figures for them (aggregate those with max(), not sum(), across replicas).
 */
@Injectable()
export class MetricsService {
  readonly registry = new Registry();
  readonly requests: Counter<'method' | 'route' | 'status'>;
  readonly latency: Histogram<'method' | 'route' | 'status'>;

  constructor(pool: Pool, queue: MetricsRepository, outbox: MailOutboxRepository, payments: PaymentsRepository) {
    const registers = [this.registry];
    collectDefaultMetrics({ register: this.registry, prefix: 'loomwright_' });
    this.requests = new Counter({
      name: 'loomwright_http_requests_total',
      help: 'HTTP answers given, by route pattern and status.',
      labelNames: ['method', 'route', 'status'],
      registers,
    });
    this.latency = new Histogram({
      name: 'loomwright_http_request_duration_seconds',
      help: 'Time from request to the end of the answer, by route pattern and status.',
      labelNames: ['method', 'route', 'status'],
      buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
      registers,
    });
    new Gauge({
      name: 'loomwright_db_pool_connections',
      help: "This process's PostgreSQL pool: connections open (total), idle, and callers waiting for one.",
      labelNames: ['state'],
      registers,
      collect() {
        this.set({ state: 'total' }, pool.totalCount);
        this.set({ state: 'idle' }, pool.idleCount);
        this.set({ state: 'waiting' }, pool.waitingCount);
      },
    });
    new Gauge({ name: 'loomwright_db_pool_max', help: "The most connections this process's pool opens.", registers }).set(
      pool.options.max ?? 10,
    );
    const read = (query: () => Promise<void>) => query().catch(() => undefined);
    new Gauge({
      name: 'loomwright_jobs',
      help: 'Background jobs (pg-boss) by queue and state: created and retry are waiting (the queue depth), failed gave up.',
      labelNames: ['queue', 'state'],
      registers,
      async collect() {
        await read(async () => {
          const rows = await queue.jobsByQueueAndState();
          this.reset();
          for (const r of rows) this.set({ queue: r.name, state: r.state }, Number(r.n));
        });
      },
    });
    new Gauge({
      name: 'loomwright_mail_messages',
      help: 'Messages in the mail outbox by state: sent, failed (given up), unknown (outcome unknown), queued and sending.',
      labelNames: ['state'],
      registers,
      async collect() {
        await read(async () => {
          const rows = await outbox.countsByState();
          this.reset();
          for (const state of ['queued', 'sending', 'sent', 'failed', 'unknown']) this.set({ state }, 0);
          for (const r of rows) this.set({ state: r.state }, Number(r.n));
        });
      },
    });
    new Gauge({
      name: 'loomwright_payments',
      help: 'Payments by kind (deposit, balance, …) and outcome (the payment status).',
      labelNames: ['kind', 'outcome'],
      registers,
      async collect() {
        await read(async () => {
          const rows = await payments.countsByKindAndStatus();
          this.reset();
          for (const r of rows) this.set({ kind: r.kind, outcome: r.status }, Number(r.n));
        });
      },
    });
  }

  /** Express middleware: counts each answer under its route pattern (never the raw URL, which would explode the labels). */
  middleware() {
    return (
      req: { method: string; baseUrl?: string; route?: { path?: string }; originalUrl?: string },
      res: { statusCode: number; once(e: 'finish' | 'close', f: () => void): void },
      next: () => void,
    ) => {
      const end = this.latency.startTimer();
      let done = false;
      const finish = () => {
        if (done) return;
        done = true;
        const url = req.originalUrl ?? '';
        const route = req.route?.path ? `${req.baseUrl ?? ''}${req.route.path}` : url.startsWith('/api') ? 'unmatched' : 'static';
        const labels = { method: req.method, route, status: String(res.statusCode) };
        this.requests.inc(labels);
        end(labels);
      };
      res.once('finish', finish);
      res.once('close', finish);
      next();
    };
  }
}
