export interface DecodedMail {
  body: string;
  links: string[];
}

function bytesToText(bytes: number[]): string {
  return new TextDecoder('utf-8').decode(new Uint8Array(bytes));
}

// RFC 2045 6.7: "=" at a line end is a soft break; "=XX" is one byte.
function decodeQuotedPrintable(text: string): string {
  const joined = text.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const hex = joined[i] === '=' ? joined.slice(i + 1, i + 3) : '';
    if (/^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...new TextEncoder().encode(joined[i]));
    }
  }
  return bytesToText(bytes);
}

function decodeBase64(text: string): string {
  const binary = atob(text.replace(/\s+/g, ''));
  return bytesToText([...binary].map((c) => c.charCodeAt(0)));
}

/** The readable body and the web links of a single-part text message, so a demo can follow them. */
export function decodeMail(raw: string): DecodedMail {
  const split = raw.search(/\r?\n\r?\n/);
  const head = split < 0 ? raw : raw.slice(0, split);
  const rawBody = split < 0 ? '' : raw.slice(split).replace(/^\r?\n\r?\n/, '');
  const encoding = /^content-transfer-encoding:\s*([\w-]+)/im.exec(head)?.[1]?.toLowerCase();
  let body = rawBody;
  try {
    if (encoding === 'quoted-printable') body = decodeQuotedPrintable(rawBody);
    else if (encoding === 'base64') body = decodeBase64(rawBody);
  } catch {
    body = rawBody;
  }
  const links = [...new Set(body.match(/https?:\/\/[^\s<>"')]+/g) ?? [])];
  return { body, links };
}
