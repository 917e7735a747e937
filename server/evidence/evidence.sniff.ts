import { parse } from 'csv-parse/sync';
import { EVIDENCE_EXTENSIONS, type EvidenceMediaType } from '../../shared/schemas/evidence.js';

// Signature bytes: PNG (ISO/IEC 15948 §5.2, then the IHDR chunk), JPEG (SOI marker then a marker), PDF (ISO 32000 header).
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const JPEG = Buffer.from([0xff, 0xd8, 0xff]);
const PDF = Buffer.from('%PDF-', 'latin1');
const CSV_DELIMITERS = [',', ';', '\t'];

export type Sniffed = { mediaType: EvidenceMediaType; problem?: undefined } | { mediaType?: undefined; problem: string };

const startsWith = (b: Buffer, sig: Buffer, at = 0) => b.length >= at + sig.length && b.subarray(at, at + sig.length).equals(sig);

/** The type of a file from its bytes alone; a CSV has no signature, so it must decode as text and parse. */
export function sniff(bytes: Buffer): Sniffed {
  if (bytes.length === 0) return { problem: 'the file is empty' };
  if (startsWith(bytes, PNG) && bytes.subarray(12, 16).toString('latin1') === 'IHDR') return { mediaType: 'image/png' };
  if (startsWith(bytes, JPEG)) return { mediaType: 'image/jpeg' };
  if (startsWith(bytes, PDF)) return { mediaType: 'application/pdf' };
  return sniffCsv(bytes);
}

function sniffCsv(bytes: Buffer): Sniffed {
  const notAllowed = { problem: 'the content is not a JPEG or PNG image, a PDF or a CSV export' };
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return notAllowed;
  }
  // NUL and other control characters mean binary content, whatever the name says.
  if (/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/.test(text)) return notAllowed;
  const body = text.replace(/^\uFEFF/, '').trimStart();
  if (body.startsWith('<')) return { problem: 'the content is HTML or XML markup, not a CSV export' };
  for (const delimiter of CSV_DELIMITERS) {
    try {
      const rows = parse(body, { delimiter, skip_empty_lines: true }) as string[][];
      if (rows.length > 0 && rows[0].length >= 2) return { mediaType: 'text/csv' };
    } catch {
      // an unclosed quote or a row of another width: try the next delimiter
    }
  }
  return { problem: 'the content does not parse as a CSV export (rows of two or more columns separated by commas, semicolons or tabs)' };
}

const LABELS: Record<EvidenceMediaType, string> = { 'image/jpeg': 'a JPEG image', 'image/png': 'a PNG image', 'application/pdf': 'a PDF', 'text/csv': 'a CSV export' };

/** A name whose extension claims another type is refused rather than trusted or silently renamed. */
export function nameProblem(fileName: string, mediaType: EvidenceMediaType): string | null {
  const dot = fileName.lastIndexOf('.');
  if (dot <= 0) return null;
  const ext = fileName.slice(dot + 1).toLowerCase();
  if (EVIDENCE_EXTENSIONS[mediaType].includes(ext)) return null;
  return `the name ends in .${ext} but the content is ${LABELS[mediaType]}`;
}

/** The client's name without any path, control or markup characters, at most 120 characters, with an extension. */
export function safeFileName(original: string | undefined, mediaType: EvidenceMediaType): string {
  let name = (original ?? '').normalize('NFC').split(/[\\/]/).pop() ?? '';
  name = name
    .replace(/[\p{Cc}\p{Cf}]/gu, '')
    .replace(/[^\p{L}\p{M}\p{N} ._()+,=@-]/gu, '_')
    .replace(/\s+/g, ' ')
    .replace(/_{2,}/g, '_')
    .replace(/^[\s.]+|[\s.]+$/g, '');
  const dot = name.lastIndexOf('.');
  const ext = dot > 0 ? name.slice(dot) : '';
  let base = dot > 0 ? name.slice(0, dot) : name;
  if (!base) base = 'evidence';
  const extension = ext || `.${EVIDENCE_EXTENSIONS[mediaType][0]}`;
  return base.slice(0, 120 - extension.length) + extension;
}
