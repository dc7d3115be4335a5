/**
 * Just enough MIME to read what nodemailer sends to the capture server: headers (unfolded,
 * RFC 2047 encoded words), multipart bodies, quoted-printable and base64 parts.
 */

export interface ParsedMessage {
  headers: Map<string, string>;
  subject: string;
  text: string;
  html: string;
}

function splitHead(raw: string): { head: string; body: string } {
  const i = raw.search(/\r?\n\r?\n/);
  if (i < 0) return { head: raw, body: '' };
  const sep = raw.slice(i).startsWith('\r\n\r\n') ? 4 : raw.slice(i).startsWith('\n\r\n') ? 3 : 2;
  return { head: raw.slice(0, i), body: raw.slice(i + sep) };
}

function parseHeaders(head: string): Map<string, string> {
  const map = new Map<string, string>();
  const unfolded = head.replace(/\r?\n[ \t]+/g, ' ');
  for (const line of unfolded.split(/\r?\n/)) {
    const c = line.indexOf(':');
    if (c > 0) map.set(line.slice(0, c).trim().toLowerCase(), line.slice(c + 1).trim());
  }
  return map;
}

function decodeQp(s: string): Buffer {
  const soft = s.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < soft.length; i++) {
    const ch = soft[i]!;
    if (ch === '=' && /^[0-9A-Fa-f]{2}$/.test(soft.slice(i + 1, i + 3))) {
      bytes.push(parseInt(soft.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      for (const b of Buffer.from(ch, 'utf8')) bytes.push(b);
    }
  }
  return Buffer.from(bytes);
}

/** `=?UTF-8?Q?...?=` and `=?UTF-8?B?...?=` words in a header value. */
export function decodeWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_m, _charset: string, enc: string, text: string) =>
      enc.toUpperCase() === 'B' ? Buffer.from(text, 'base64').toString('utf8') : decodeQp(text.replace(/_/g, ' ')).toString('utf8'),
    );
}

function param(value: string, name: string): string | null {
  const m = new RegExp(`${name}="?([^";]+)"?`, 'i').exec(value);
  return m ? m[1]! : null;
}

function decodeBody(body: string, headers: Map<string, string>): string {
  const enc = (headers.get('content-transfer-encoding') ?? '7bit').toLowerCase();
  if (enc === 'quoted-printable') return decodeQp(body).toString('utf8');
  if (enc === 'base64') return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
  return body;
}

function walk(raw: string, out: { text: string; html: string }): Map<string, string> {
  const { head, body } = splitHead(raw);
  const headers = parseHeaders(head);
  const type = headers.get('content-type') ?? 'text/plain';
  const boundary = param(type, 'boundary');
  if (/^multipart\//i.test(type) && boundary) {
    const parts = body.split(`--${boundary}`);
    for (const part of parts.slice(1)) {
      if (part.startsWith('--')) break;
      walk(part.replace(/^\r?\n/, ''), out);
    }
  } else if (/^text\/html/i.test(type)) {
    out.html ||= decodeBody(body, headers).replace(/\r?\n$/, '');
  } else if (/^text\/plain/i.test(type)) {
    out.text ||= decodeBody(body, headers).replace(/\r?\n$/, '');
  }
  return headers;
}

export function parseMessage(raw: string): ParsedMessage {
  const out = { text: '', html: '' };
  const headers = walk(raw, out);
  return { headers, subject: decodeWords(headers.get('subject') ?? ''), text: out.text, html: out.html };
}
