import { afterEach, describe, expect, it, vi } from 'vitest';
import EvidenceUpload from '@/components/EvidenceUpload.vue';
import EvidenceList from '@/components/EvidenceList.vue';
import { getByRole, mountWith, settle, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

interface Sent { method: string; url: string; body: unknown }

/** fetch for multipart bodies (the shared fake reads JSON only). */
function serve(reply: (s: Sent) => { status: number; body: unknown }): Sent[] {
  const sent: Sent[] = [];
  vi.stubGlobal('fetch', vi.fn(async (url: string, init: RequestInit = {}) => {
    const s = { method: init.method ?? 'GET', url, body: init.body };
    sent.push(s);
    const r = reply(s);
    return new Response(JSON.stringify(r.body), { status: r.status, headers: { 'Content-Type': 'application/json' } });
  }));
  return sent;
}

async function choose(input: HTMLElement, file: File) {
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  input.dispatchEvent(new Event('change'));
  await settle();
}

describe('evidence upload', () => {
  it('when opened, then one input opens the rear camera for a photo and the other takes images, PDFs and CSV files', async () => {
    serve(() => ({ status: 404, body: {} }));
    await mountWith(EvidenceUpload, { user: userWith(['technician']), props: { entity: 'person' } });
    const camera = document.querySelector('input[aria-label="Take a photo"]')!;
    expect(camera.getAttribute('capture')).toBe('environment');
    expect(camera.getAttribute('accept')).toBe('image/*');
    const picker = document.querySelector('input[aria-label="Choose a file"]')!;
    expect(picker.getAttribute('accept')).toBe('image/*,application/pdf,.csv');
    expect(picker.hasAttribute('capture')).toBe(false);
  });

  it('when a file is chosen and uploaded, then a multipart form goes to the server; a refusal is shown beside the file', async () => {
    const sent = serve(() => ({ status: 422, body: { error: { code: 'unprocessable', message: 'file: the content is HTML or XML markup, not a CSV export', fields: { file: 'the content is HTML or XML markup, not a CSV export' } } } }));
    await mountWith(EvidenceUpload, { user: userWith(['technician']), props: { entity: 'bench_check', entityId: 'c-1' } });
    await choose(document.querySelector('input[aria-label="Choose a file"]') as HTMLElement, new File(['<html></html>'], 'photo.png', { type: 'image/png' }));
    getByRole('button', 'Upload').click();
    await settle();
    expect(sent[0].method).toBe('POST');
    expect(sent[0].url).toBe('/api/evidence');
    const form = sent[0].body as FormData;
    expect(form.get('entity')).toBe('bench_check');
    expect(form.get('entityId')).toBe('c-1');
    expect((form.get('file') as File).name).toBe('photo.png');
    expect(document.body.textContent).toContain('the content is HTML or XML markup, not a CSV export');
  });
});

describe('evidence list', () => {
  it('when a record has an image and a PDF, then the image is shown and the PDF is previewed in a frame and offered as a download', async () => {
    const base = { ownerId: 'o', ownerName: 'Tomasz Wójcik', siteId: 's', uploaderId: 'o', uploaderName: 'Tomasz Wójcik', entity: 'person', entityId: 'o', sha256: 'a'.repeat(64), caption: null, uploadedAt: '2026-03-02T09:00:00.000Z' };
    serve(() => ({ status: 200, body: { total: 2, page: 1, pageSize: 50, items: [
      { ...base, id: 'e1', fileName: 'scope.png', mediaType: 'image/png', sizeBytes: 2048, contentUrl: '/api/evidence/e1/content' },
      { ...base, id: 'e2', fileName: 'ir-test.pdf', mediaType: 'application/pdf', sizeBytes: 4096, contentUrl: '/api/evidence/e2/content' },
    ] } }));
    await mountWith(EvidenceList, { user: userWith(['technician']), props: { ownerId: 'o' } });
    expect(document.querySelector('img')?.getAttribute('src')).toBe('/api/evidence/e1/content');
    expect(getByRole('link', 'Download the PDF').getAttribute('href')).toBe('/api/evidence/e2/content');
    const frame = document.querySelector('iframe');
    expect(frame?.getAttribute('src')).toBe('/api/evidence/e2/content?preview=1');
    expect(frame?.getAttribute('title')).toBe('Preview of ir-test.pdf');
  });
});
