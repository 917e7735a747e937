import type { Request, Response } from 'express';
import multer from 'multer';
import { createHash } from 'node:crypto';
import { AppError } from '../errors.js';
import type { EvidenceRow } from '../../shared/schemas/evidence.js';

const megabytes = (n: number) => `${Math.round((n / 1_048_576) * 10) / 10} MB`;

function uploadError(err: unknown, maxBytes: number): AppError {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return new AppError(413, 'too_large', `file: larger than the ${megabytes(maxBytes)} allowed`, { file: `larger than the ${megabytes(maxBytes)} allowed` });
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') return new AppError(400, 'invalid_input', 'file: send one file, in the field "file"', { file: 'send one file, in the field "file"' });
    const field = err.field ?? 'form';
    return new AppError(400, 'invalid_input', `${field}: ${err.message}`, { [field]: err.message });
  }
  return new AppError(400, 'malformed_upload', 'The upload could not be read as a multipart form.', { file: 'could not be read' });
}

/** The route's `before` hook: parses the multipart form into memory once access is known to be allowed. */
export function parseUpload(maxBytes: number) {
  const middleware = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 10, fieldSize: 2_000, parts: 12 },
    defParamCharset: 'utf8',
  }).single('file');
  return (req: Request, res: Response) =>
    new Promise<void>((resolve, reject) => middleware(req, res, (err?: unknown) => (err ? reject(uploadError(err, maxBytes)) : resolve())));
}

/** An RFC 6266 header with an ASCII fallback; the name was already cleaned of quotes and control characters. */
function disposition(type: 'inline' | 'attachment', name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  const encoded = encodeURIComponent(name).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${type}; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/**
 * Sends stored evidence so that no browser runs it: its own type only, no sniffing, no scripts, images
 * inline and the rest downloaded. A PDF asked for as a preview opens inline in the browser's own viewer,
 * framed by our pages only (a sandboxed response would stop the viewer from drawing it).
 */
export function sendEvidence(res: Response, meta: EvidenceRow, bytes: Buffer, preview = false): void {
  const image = meta.mediaType.startsWith('image/');
  const pdfPreview = preview && meta.mediaType === 'application/pdf';
  res.status(200);
  res.setHeader('Content-Type', meta.mediaType === 'text/csv' ? 'text/csv; charset=utf-8' : meta.mediaType);
  res.setHeader('Content-Length', String(bytes.length));
  res.setHeader('Content-Disposition', disposition(image || pdfPreview ? 'inline' : 'attachment', meta.fileName));
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Content-Security-Policy', pdfPreview ? "default-src 'none'; frame-ancestors 'self'" : "default-src 'none'; frame-ancestors 'none'; sandbox");
  res.setHeader('Cache-Control', 'private, no-store');
  res.setHeader('Repr-Digest', `sha-256=:${createHash('sha256').update(bytes).digest('base64')}:`);
  res.end(bytes);
}
