import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { MailLogEntry, MailLogPage } from '@loomwright/shared';
import { theme } from 'src/theme';
import { MailLogTable } from './MailLogTable';
import { renderWithProviders } from '@loomwright/shared/ui/testing';

const entry = (over: Partial<MailLogEntry>): MailLogEntry => ({
  id: '11111111-1111-4111-8111-111111111111',
  messageId: '<a@shop.example>',
  template: 'booking-scheduled',
  to: 'player@mail.example',
  subject: 'Booked: bench date Tue 12 Jan 2027 for LW-1042',
  state: 'sent',
  attempts: 1,
  lastError: null,
  bookingId: null,
  resentFromId: null,
  createdAt: '2027-01-04T10:00:00Z',
  sentAt: '2027-01-04T10:00:02Z',
  ...over,
});

function stubApi(page: MailLogPage) {
  const calls: { url: string; method: string; body?: string }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init?: RequestInit) => {
      calls.push({ url, method: init?.method ?? 'GET', body: typeof init?.body === 'string' ? init.body : undefined });
      const body = init?.method === 'POST' ? { ...page.items[0], id: 'new', state: 'queued' } : page;
      return new Response(JSON.stringify(body), { status: init?.method === 'POST' ? 201 : 200 });
    }),
  );
  return calls;
}

const renderTable = () => renderWithProviders(<MailLogTable />, { theme });

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('MailLogTable', () => {
  const items = [
    entry({}),
    entry({
      id: '22222222-2222-4222-8222-222222222222',
      to: 'cass@mail.example',
      template: 'password-reset',
      subject: null,
      state: 'failed',
      attempts: 8,
      lastError: 'ECONNREFUSED: connect ECONNREFUSED 127.0.0.1:2525',
      sentAt: null,
    }),
  ];

  it('shows each message with its state in words, attempts and error, and asks the API for the page', async () => {
    const calls = stubApi({ items, total: 2, page: 1, pageSize: 25, canResend: false });
    renderTable();
    expect(await screen.findByText('Booked: bench date Tue 12 Jan 2027 for LW-1042')).toBeTruthy();
    const table = within(screen.getByRole('table'));
    expect(table.getByText('Sent')).toBeTruthy();
    expect(table.getByText('Not sent')).toBeTruthy();
    expect(table.getByText('ECONNREFUSED: connect ECONNREFUSED 127.0.0.1:2525')).toBeTruthy();
    expect(table.getByText('8')).toBeTruthy();
    expect(screen.getByText('2 messages')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Resend/ })).toBeNull();
    expect(calls[0].url).toContain('/api/mail?page=1&pageSize=25');
  });

  it('searches by recipient from the first page', async () => {
    const calls = stubApi({ items, total: 2, page: 1, pageSize: 25, canResend: false });
    renderTable();
    await screen.findByText('2 messages');
    fireEvent.change(screen.getByLabelText('Recipient'), { target: { value: 'cass' } });
    await waitFor(() => expect(calls.some((c) => c.url.includes('q=cass') && c.url.includes('page=1'))).toBe(true));
  });

  it('lets the owner resend a message, and not one still waiting to go out', async () => {
    const calls = stubApi({
      items: [...items, entry({ id: '33333333-3333-4333-8333-333333333333', state: 'queued', to: 'wait@mail.example' })],
      total: 3,
      page: 1,
      pageSize: 25,
      canResend: true,
    });
    renderTable();
    const button = await screen.findByRole('button', { name: /Resend .* to cass@mail.example/ });
    expect((screen.getByRole('button', { name: /to wait@mail.example/ }) as HTMLButtonElement).disabled).toBe(true);
    fireEvent.click(button);
    await waitFor(() =>
      expect(calls.some((c) => c.method === 'POST' && c.url.endsWith('/api/mail/22222222-2222-4222-8222-222222222222/resend'))).toBe(true),
    );
    expect(await screen.findByText('Queued again with a fresh link; the earlier link no longer works.')).toBeTruthy();
  });

  it('warns before resending a message whose outcome is unknown, and sends only on confirmation', async () => {
    const unknown = entry({
      id: '44444444-4444-4444-8444-444444444444',
      state: 'unknown',
      to: 'maybe@mail.example',
      lastError: 'Outcome unknown: the mail server may have received this message.',
    });
    const calls = stubApi({ items: [unknown], total: 1, page: 1, pageSize: 25, canResend: true });
    renderTable();
    const resendButton = await screen.findByRole('button', { name: /Resend .* to maybe@mail.example/ });
    expect(within(screen.getByRole('table')).getByText('May have arrived (outcome unknown)')).toBeTruthy();
    fireEvent.click(resendButton);
    const dialog = await screen.findByRole('alertdialog');
    expect(within(dialog).getByText(/may be in\s+their mailbox already/)).toBeTruthy();
    fireEvent.click(within(dialog).getByRole('button', { name: 'Don’t send' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).toBeNull());
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);

    fireEvent.click(await screen.findByRole('button', { name: /Resend .* to maybe@mail.example/ }));
    fireEvent.click(within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Send a second copy' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1));
    const post = calls.find((c) => c.method === 'POST')!;
    expect(post.url).toMatch(/\/api\/mail\/44444444-4444-4444-8444-444444444444\/resend$/);
    expect(JSON.parse(post.body!)).toEqual({ confirmPossibleDuplicate: true });
    expect(await screen.findByText('Queued again as a new message.')).toBeTruthy();
  });
});
