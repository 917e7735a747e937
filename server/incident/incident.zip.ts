import { createHash } from 'node:crypto';
import JSZip from 'jszip';
import type { IncidentPack } from './incident.types.js';

const safe = (s: string) => s.replace(/[^A-Za-z0-9._-]+/g, '_').slice(0, 120) || 'file';

/** The PDF, every file behind the records (under evidence/<kind>-<record id>/), and a manifest of hashes. */
export async function buildIncidentZip(pack: IncidentPack, pdf: Uint8Array, contents: Map<string, Buffer>): Promise<Buffer> {
  const zip = new JSZip();
  const stamp = new Date(0);
  const add = (name: string, data: Uint8Array | Buffer | string) => zip.file(name, data, { date: stamp, binary: typeof data !== 'string' });
  add('incident-pack.pdf', pdf);
  const manifest = [{ path: 'incident-pack.pdf', sha256: createHash('sha256').update(pdf).digest('hex'), bytes: pdf.length }];
  for (const f of pack.files) {
    const bytes = contents.get(f.id);
    if (!bytes) continue;
    const path = `evidence/${safe(f.entity)}-${f.entityId}/${f.id.slice(0, 8)}-${safe(f.fileName)}`;
    add(path, bytes);
    manifest.push({ path, sha256: f.sha256, bytes: bytes.length });
  }
  add('manifest.json', JSON.stringify({ person: pack.person.name, at: pack.at.toISOString(), producedAt: pack.producedAt.toISOString(), producedBy: pack.producedBy, files: manifest }, null, 2));
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 6 } });
}
