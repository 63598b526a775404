// Just enough MIME for tests to read what nodemailer sent: headers, the plain-text part, the two common encodings.
export interface ParsedMessage {
  subject: string;
  text: string;
  headers: Record<string, string>;
}

function splitHeaders(raw: string): { headers: Record<string, string>; body: string } {
  const cut = raw.search(/\r?\n\r?\n/);
  const head = cut === -1 ? raw : raw.slice(0, cut);
  const body = cut === -1 ? '' : raw.slice(cut).replace(/^\r?\n\r?\n/, '');
  const headers: Record<string, string> = {};
  // Folded header lines start with whitespace and belong to the previous header.
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon > 0) headers[line.slice(0, colon).trim().toLowerCase()] = line.slice(colon + 1).trim();
  }
  return { headers, body };
}

function decodeQuotedPrintable(text: string): string {
  const bytes = text
    .replace(/=\r?\n/g, '')
    .replace(/=([0-9A-Fa-f]{2})/g, (_m, hex: string) => String.fromCharCode(parseInt(hex, 16)));
  return Buffer.from(bytes, 'latin1').toString('utf8');
}

function decodeBody(body: string, encoding: string | undefined): string {
  switch ((encoding ?? '').toLowerCase()) {
    case 'base64':
      return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
    case 'quoted-printable':
      return decodeQuotedPrintable(body);
    default:
      return body;
  }
}

// Non-ASCII subjects arrive as RFC 2047 encoded words.
function decodeEncodedWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_m, _charset: string, kind: string, data: string) =>
      kind.toUpperCase() === 'B'
        ? Buffer.from(data, 'base64').toString('utf8')
        : decodeQuotedPrintable(data.replace(/_/g, ' ')),
    );
}

function plainText(headers: Record<string, string>, body: string): string {
  const type = headers['content-type'] ?? 'text/plain';
  const boundary = /boundary="?([^";]+)"?/i.exec(type)?.[1];
  if (/^multipart\//i.test(type) && boundary) {
    for (const part of body.split(`--${boundary}`).slice(1)) {
      if (part.startsWith('--')) break;
      const inner = splitHeaders(part.replace(/^\r?\n/, ''));
      const text = plainText(inner.headers, inner.body);
      if (text) return text;
    }
    return '';
  }
  if (!/^text\/plain/i.test(type)) return '';
  return decodeBody(body, headers['content-transfer-encoding']).replace(/\r?\n$/, '');
}

export function parseMessage(raw: string): ParsedMessage {
  const { headers, body } = splitHeaders(raw);
  return { subject: decodeEncodedWords(headers.subject ?? ''), text: plainText(headers, body).trimEnd(), headers };
}
