import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import fontkit from '@pdf-lib/fontkit';
import { PDFDocument, rgb, type PDFFont } from 'pdf-lib';
import QRCode from 'qrcode';

// Full TrueType Roboto: the standard PDF fonts cannot draw Ω, ≤ or most accented names.
const require = createRequire(import.meta.url);
const font = (file: string) => readFileSync(require.resolve(`@expo-google-fonts/roboto/${file}`));
let fonts: { regular: Buffer; bold: Buffer; covers: (cp: number) => boolean } | null = null;
function loadFonts() {
  if (!fonts) {
    const regular = font('400Regular/Roboto_400Regular.ttf');
    const face = fontkit.create(regular) as unknown as { hasGlyphForCodePoint(cp: number): boolean };
    fonts = { regular, bold: font('700Bold/Roboto_700Bold.ttf'), covers: (cp) => face.hasGlyphForCodePoint(cp) };
  }
  return fonts;
}

export interface CertificateData {
  holderName: string;
  siteName: string;
  scopeCode: string;
  scopeTitle: string;
  scopeDescription: string;
  limits: string;
  validFrom: string;
  validUntil: string;
  stateLine: string;
  issuer: string;
  evidence: string[];
  verificationCode: string;
  verifyUrl: string;
  caution: string;
  producedAt: string;
}

const INK = rgb(0.12, 0.16, 0.23);
const MUTED = rgb(0.38, 0.42, 0.48);
const WARN = rgb(0.55, 0.33, 0);

/** One A4 page: who may do what within which limits, from when to when, on what evidence, and how to check it. */
export async function certificatePdf(d: CertificateData): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.registerFontkit(fontkit);
  const f = loadFonts();
  const regular = await doc.embedFont(f.regular, { subset: true });
  const bold = await doc.embedFont(f.bold, { subset: true });
  doc.setTitle(`Authorisation certificate ${d.verificationCode}`);
  doc.setProducer('Breakover');
  const page = doc.addPage([595.28, 841.89]);
  const clean = (s: string) => [...s].map((ch) => (f.covers(ch.codePointAt(0)!) ? ch : '?')).join('');
  let y = 790;
  const write = (text: string, o: { size?: number; font?: PDFFont; color?: ReturnType<typeof rgb>; x?: number; width?: number; gap?: number } = {}) => {
    const size = o.size ?? 10;
    const usedFont = o.font ?? regular;
    for (const line of wrap(clean(text), usedFont, size, o.width ?? 495)) {
      page.drawText(line, { x: o.x ?? 50, y, size, font: usedFont, color: o.color ?? INK });
      y -= size * 1.35;
    }
    y -= o.gap ?? 4;
  };
  write('Breakover · Authorisation certificate', { size: 9, color: MUTED });
  write(d.scopeTitle, { size: 18, font: bold, gap: 2 });
  write(`${d.scopeCode} · ${d.limits}`, { size: 11, color: MUTED, gap: 10 });
  field(write, bold, 'Authorised person', `${d.holderName}, ${d.siteName}`);
  field(write, bold, 'Valid', `from ${d.validFrom} to ${d.validUntil} (end of that day)`);
  field(write, bold, 'State when printed', d.stateLine);
  field(write, bold, 'Issued', d.issuer);
  if (d.scopeDescription) field(write, bold, 'Covers', d.scopeDescription);
  write('Issued on this evidence', { size: 11, font: bold, gap: 2 });
  for (const line of d.evidence) write(`• ${line}`, { x: 60, width: 330 });
  y -= 6;
  const qr = await doc.embedPng(await QRCode.toBuffer(d.verifyUrl, { type: 'png', margin: 1, width: 300, errorCorrectionLevel: 'M' }));
  const qrTop = Math.min(y, 330);
  page.drawImage(qr, { x: 420, y: qrTop - 125, width: 125, height: 125 });
  y = qrTop;
  write('Check it', { size: 11, font: bold, width: 350, gap: 2 });
  write(`Verification code: ${d.verificationCode}`, { font: bold, width: 350 });
  write(`Scan the code or open ${d.verifyUrl} to see whether this authorisation is current.`, { width: 350 });
  y = Math.min(y, qrTop - 145);
  write(d.caution, { size: 10, font: bold, color: WARN, gap: 10 });
  write(`Printed ${d.producedAt}. A printed certificate may be out of date: the verification page is the record.`, { size: 8, color: MUTED });
  return doc.save();
}

function field(write: (t: string, o?: { size?: number; font?: PDFFont; gap?: number }) => void, bold: PDFFont, label: string, value: string) {
  write(label, { size: 8, font: bold, gap: 0 });
  write(value, { size: 11, gap: 6 });
}

function wrap(text: string, font: PDFFont, size: number, width: number): string[] {
  const lines: string[] = [];
  for (const para of text.split('\n')) {
    let line = '';
    for (const word of para.split(/\s+/)) {
      const next = line ? `${line} ${word}` : word;
      if (font.widthOfTextAtSize(next, size) > width && line) {
        lines.push(line);
        line = word;
      } else line = next;
    }
    lines.push(line);
  }
  return lines;
}

