/**
 * Reads the text of a single-part plain-text message (what Rampart sends), undoing the transfer
 * encoding nodemailer picked: quoted-printable (RFC 2045 §6.7), base64 (§6.8) or none.
 */
export function plainTextBody(raw: string): string {
  const split = raw.search(/\r?\n\r?\n/);
  if (split < 0) return '';
  const head = raw.slice(0, split).replace(/\r?\n[ \t]+/g, ' ');
  const body = raw.slice(split).replace(/^\r?\n\r?\n/, '');
  const encoding = /^content-transfer-encoding:\s*([^\s;]+)/im.exec(head)?.[1]?.toLowerCase();
  if (encoding === 'base64')
    return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8');
  if (encoding === 'quoted-printable') return decodeQuotedPrintable(body);
  return body.replace(/\r\n/g, '\n');
}

function decodeQuotedPrintable(body: string): string {
  const joined = body.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const hex = joined.slice(i + 1, i + 3);
    if (joined[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(joined[i] ?? '', 'utf8'));
    }
  }
  return Buffer.from(bytes).toString('utf8').replace(/\r\n/g, '\n');
}

/** Every http(s) link in `text`, in order. */
export function linksIn(text: string): string[] {
  return text.match(/https?:\/\/[^\s<>"]+/g) ?? [];
}
