import type { CaughtMessage } from './mail-fake';

// The fake's own small mailbox page: a list on the left, one message on its own page.
// Plain server-rendered HTML; the message's HTML body is shown in a sandboxed frame so its
// styles and any script cannot touch the page.

const escape = (value: string) =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const when = (iso: string) => new Date(iso).toUTCString().replace(' GMT', ' UTC');

const page = (title: string, body: string) => `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escape(title)}</title>
<style>
  :root { --ground:#f7f4ef; --ink:#2a211c; --muted:#6b615a; --line:#ddd5cb; --jacket:#1f5a57; --copper:#9a5a2c; }
  * { box-sizing: border-box; }
  body { margin:0; font: 15px/1.5 system-ui, sans-serif; background:var(--ground); color:var(--ink); }
  header { padding:12px 24px; background:var(--jacket); color:#fff; display:flex; gap:16px; align-items:baseline; }
  header h1 { font-size:18px; margin:0; }
  header span { opacity:.85; font-size:13px; }
  main { padding:16px 24px; max-width:1100px; }
  table { border-collapse:collapse; width:100%; background:#fff; border:1px solid var(--line); }
  th, td { text-align:left; padding:6px 10px; border-bottom:1px solid var(--line); font-size:14px; vertical-align:top; }
  th { color:var(--muted); font-weight:600; }
  td.when { white-space:nowrap; font-variant-numeric: tabular-nums; color:var(--muted); }
  a { color:var(--jacket); } a:focus-visible { outline:3px solid var(--copper); outline-offset:2px; }
  dl { display:grid; grid-template-columns:max-content 1fr; gap:4px 16px; margin:0 0 16px; }
  dt { color:var(--muted); } dd { margin:0; }
  pre { white-space:pre-wrap; background:#fff; border:1px solid var(--line); padding:12px; font-size:13px; }
  iframe { width:100%; min-height:520px; border:1px solid var(--line); background:#fff; }
  h2 { font-size:20px; } h3 { font-size:16px; margin-top:24px; }
  .empty { color:var(--muted); }
</style></head><body>
<header><h1>Local mailbox</h1><span>Every message the app sends on this machine lands here; nothing goes out.</span></header>
<main>${body}</main></body></html>`;

export function renderMailbox(messages: CaughtMessage[]): string {
  const rows = messages
    .map(
      (m) => `<tr><td class="when">${escape(when(m.date))}</td><td>${escape(m.to.join(', '))}</td>
<td><a href="/messages/${m.id}">${escape(m.subject || '(no subject)')}</a></td>
<td>${m.attachments.length ? `${m.attachments.length} attached` : ''}</td></tr>`,
    )
    .join('\n');
  return page(
    'Local mailbox',
    messages.length
      ? `<p>${messages.length} message${messages.length === 1 ? '' : 's'}, newest first. JSON at <a href="/api/messages">/api/messages</a>.</p>
<table><thead><tr><th>Received</th><th>To</th><th>Subject</th><th>Files</th></tr></thead><tbody>${rows}</tbody></table>`
      : '<p class="empty">No messages yet. Anything the app sends will show up here.</p>',
  );
}

export function renderMessage(m: CaughtMessage): string {
  const files = m.attachments
    .map(
      (a, i) =>
        `<li><a href="/messages/${m.id}/attachments/${i}">${escape(a.filename ?? 'attachment')}</a> (${escape(a.contentType)}, ${a.size} bytes)</li>`,
    )
    .join('');
  return page(
    m.subject,
    `<p><a href="/">← All messages</a></p>
<h2>${escape(m.subject || '(no subject)')}</h2>
<dl><dt>From</dt><dd>${escape(m.from ?? '')}</dd><dt>To</dt><dd>${escape(m.to.join(', '))}</dd>
<dt>Received</dt><dd>${escape(when(m.date))}</dd><dt>Message-ID</dt><dd>${escape(m.messageId ?? '')}</dd></dl>
${files ? `<h3>Attachments</h3><ul>${files}</ul>` : ''}
${m.html ? `<h3>HTML</h3><iframe sandbox title="HTML body" srcdoc="${escape(m.html)}"></iframe>` : ''}
<h3>Plain text</h3><pre>${escape(m.text)}</pre>`,
  );
}
