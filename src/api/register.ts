import type { Page } from '@shared/schemas/common';
import type { RegisterQuery, MatrixQuery } from '@shared/schemas/register';
import type { AuditTrailQuery } from '@shared/schemas/audit-trail';
import type { FindingBody, FindingsQuery } from '@shared/schemas/findings';
import type {
  AuditEntryView, ChainReportView, FindingView, MatrixPage, OverviewView, PersonRecordView, RegisterPage, RowEvidenceView,
} from '@shared/register/views';
import { api, ApiError } from './client';

export type { RegisterPage, RowEvidenceView, MatrixPage, AuditEntryView, ChainReportView, FindingView, OverviewView, PersonRecordView };
export type RegisterRow = RegisterPage['items'][number];

type Query = Record<string, string | number | boolean | undefined | null>;

/** A GET link for a download the browser saves itself (the session cookie goes with it). */
export function downloadUrl(path: string, query: Query): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  return `/api${path}?${params}`;
}

/** POSTs and saves the answer as a file (the incident pack); failures become the usual ApiError. */
async function postForFile(path: string, body: unknown): Promise<{ blob: Blob; fileName: string }> {
  const res = await fetch(`/api${path}`, { method: 'POST', credentials: 'same-origin', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) });
  if (!res.ok) {
    const data = (await res.json().catch(() => null)) as { error?: { code: string; message: string; fields?: Record<string, string> } } | null;
    throw new ApiError(res.status, data?.error?.code ?? 'http_error', data?.error?.message ?? `The server answered ${res.status}.`, data?.error?.fields ?? {});
  }
  const name = /filename="([^"]+)"/.exec(res.headers.get('Content-Disposition') ?? '')?.[1] ?? 'download';
  return { blob: await res.blob(), fileName: name };
}

export const registerApi = {
  page: (q: Partial<RegisterQuery>) => api.get<RegisterPage>('/register', { ...q }),
  evidence: (authorisationId: string, q: { at?: string; view?: string }) => api.get<RowEvidenceView>(`/register/${authorisationId}/evidence`, q),
  matrix: (q: Partial<MatrixQuery>) => api.get<MatrixPage>('/matrix', { ...q }),
  overview: (siteId?: string) => api.get<OverviewView>('/overview', { siteId }),
  record: (personId: string) => api.get<PersonRecordView>(`/people/${personId}/record`),
  incidentPack: (body: { personId: string; at: string; benchId?: string; note?: string }) => postForFile('/incident-packs', body),
};

export const auditApi = {
  page: (q: Partial<AuditTrailQuery>) => api.get<Page<AuditEntryView> & { more: boolean }>('/audit', { ...q }),
  verify: () => api.post<ChainReportView>('/audit/verify'),
};

export const findingsApi = {
  list: (q: Partial<FindingsQuery>) => api.get<Page<FindingView>>('/findings', { ...q }),
  raise: (body: FindingBody) => api.post<FindingView>('/findings', body),
  answer: (id: string, response: string) => api.post<FindingView>(`/findings/${id}/answer`, { response }),
  close: (id: string, note: string) => api.post<FindingView>(`/findings/${id}/close`, { note }),
};
