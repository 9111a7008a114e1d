/**
 * Our one simple e-mail layout: the shop's name as a header, a heading, paragraphs, an optional
 * table of facts, an optional list, one button-like link, and a quiet footer. Every message is
 * built from these blocks twice: as HTML (inline styles, since mail clients drop style sheets)
 * and as plain text with the same words.
 */
export type Block =
  | { kind: 'p'; text: string }
  | { kind: 'facts'; rows: [label: string, value: string][] }
  | { kind: 'list'; title?: string; items: string[] }
  | { kind: 'caution'; text: string }
  | { kind: 'link'; label: string; url: string };

export interface Letter {
  shopName: string;
  heading: string;
  blocks: Block[];
  footer?: string;
}

const escape = (value: string) =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

// Mail clients ignore a theme object; these are the same cable-jacket green, copper and warm
// greys as the apps' themes, written out once here.
const ink = '#2a211c';
const muted = '#6b615a';
const jacket = '#1f5a57';
const copper = '#8a4f25';
const ground = '#f7f4ef';
const line = '#ddd5cb';

function blockHtml(block: Block): string {
  switch (block.kind) {
    case 'p':
      return `<p style="margin:0 0 16px;line-height:1.5">${escape(block.text)}</p>`;
    case 'caution':
      return `<p style="margin:0 0 16px;padding:8px 12px;border-left:4px solid ${copper};background:${ground};line-height:1.5"><strong>Caution:</strong> ${escape(block.text)}</p>`;
    case 'facts':
      return `<table role="presentation" style="border-collapse:collapse;margin:0 0 16px;font-variant-numeric:tabular-nums">${block.rows
        .map(
          ([label, value]) =>
            `<tr><td style="padding:4px 16px 4px 0;color:${muted};vertical-align:top">${escape(label)}</td><td style="padding:4px 0;font-weight:600">${escape(value)}</td></tr>`,
        )
        .join('')}</table>`;
    case 'list':
      return `${block.title ? `<p style="margin:0 0 8px;font-weight:600">${escape(block.title)}</p>` : ''}<ul style="margin:0 0 16px;padding-left:20px;line-height:1.5">${block.items
        .map((item) => `<li>${escape(item)}</li>`)
        .join('')}</ul>`;
    case 'link':
      return `<p style="margin:8px 0 24px"><a href="${escape(block.url)}" style="display:inline-block;padding:10px 18px;background:${jacket};color:#ffffff;text-decoration:none;border-radius:6px;font-weight:600">${escape(block.label)}</a></p>`;
  }
}

export function letterHtml(letter: Letter): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escape(letter.heading)}</title></head>
<body style="margin:0;padding:0;background:${ground};color:${ink};font-family:Manrope,Helvetica,Arial,sans-serif;font-size:16px">
<div style="max-width:600px;margin:0 auto;padding:24px">
<p style="margin:0 0 24px;font-weight:700;font-size:14px;letter-spacing:.04em;color:${jacket}">${escape(letter.shopName)}</p>
<div style="background:#ffffff;border:1px solid ${line};border-radius:8px;padding:24px">
<h1 style="margin:0 0 16px;font-size:20px;line-height:1.3">${escape(letter.heading)}</h1>
${letter.blocks.map(blockHtml).join('\n')}
</div>
<p style="margin:16px 0 0;font-size:13px;color:${muted};line-height:1.5">${escape(letter.footer ?? `Sent by ${letter.shopName}. Reply to this message if anything is unclear.`)}</p>
</div></body></html>`;
}

function blockText(block: Block): string {
  switch (block.kind) {
    case 'p':
      return block.text;
    case 'caution':
      return `CAUTION: ${block.text}`;
    case 'facts': {
      const width = Math.max(...block.rows.map(([label]) => label.length));
      return block.rows.map(([label, value]) => `${`${label}:`.padEnd(width + 2)}${value}`).join('\n');
    }
    case 'list':
      return `${block.title ? `${block.title}\n` : ''}${block.items.map((item) => `- ${item}`).join('\n')}`;
    case 'link':
      return `${block.label}: ${block.url}`;
  }
}

export function letterText(letter: Letter): string {
  return [
    letter.shopName,
    '',
    letter.heading,
    '='.repeat(Math.min(letter.heading.length, 72)),
    '',
    letter.blocks.map(blockText).join('\n\n'),
    '',
    '--',
    letter.footer ?? `Sent by ${letter.shopName}. Reply to this message if anything is unclear.`,
    '',
  ].join('\n');
}
