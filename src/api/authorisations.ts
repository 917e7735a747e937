import type { Page } from '@shared/schemas/common';
import type { CertificateBody, ImportBody, PriorBody, ScopeInput } from '@shared/schemas/authorisations';
import type {
  AuthorisationDetail, AuthorisationSummary, CertificateView, DueView, EligibilityView, ImportJobView, ImportReport, MineView, ScopeView, VerificationView,
} from '@shared/authorisations/views';
import { api } from './client';

export type { AuthorisationDetail, AuthorisationSummary, CertificateView, DueView, EligibilityView, ImportJobView, ImportReport, MineView, ScopeView, VerificationView, ScopeInput };

export type ManagerAction = 'suspend' | 'reinstate' | 'revoke';

/** Every call of the scopes, authorisations, certificates and verification API. */
export const authorisationsApi = {
  scopes: () => api.get<ScopeView[]>('/scopes'),
  createScope: (body: ScopeInput) => api.post<ScopeView>('/scopes', body),
  updateScope: (id: string, body: ScopeInput) => api.put<ScopeView>(`/scopes/${id}`, body),
  mine: () => api.get<MineView>('/authorisations/mine'),
  due: (query: { siteId?: string; withinDays: number; page: number; pageSize: number }) => api.get<DueView>('/authorisations/due', { ...query }),
  list: (query: { holderId?: string; siteId?: string; scopeId?: string; q?: string; page: number; pageSize: number }) => api.get<Page<AuthorisationSummary>>('/authorisations', { ...query }),
  get: (id: string) => api.get<AuthorisationDetail>(`/authorisations/${id}`),
  act: (id: string, action: ManagerAction, body: { reason: string; password: string }) => api.post<{ signatureId: string }>(`/authorisations/${id}/${action}`, body),
  certificateUrl: (id: string, periodId?: string) => `/api/authorisations/${id}/certificate${periodId ? `?periodId=${periodId}` : ''}`,
  recordPrior: (body: PriorBody) => api.post<{ authorisationId: string; periodId: string }>('/authorisations/prior', body),
  importCsv: (body: ImportBody) => api.post<ImportReport>('/authorisations/import', body),
  importJob: (id: string) => api.get<ImportJobView>(`/authorisations/import/jobs/${id}`),
  eligibility: (personId: string, scopeId?: string) => api.get<EligibilityView>(`/eligibility/${personId}${scopeId ? `/${scopeId}` : ''}`),
  certificates: (query: { holderId?: string; siteId?: string; status?: string; page: number; pageSize: number }) => api.get<Page<CertificateView>>('/certificates', { ...query }),
  submitCertificate: (body: Omit<CertificateBody, 'reference'> & { reference?: string }) => api.post<CertificateView>('/certificates', body),
  verifyCertificate: (id: string, body: { password: string; sawOriginal: boolean; sawOriginalWhere?: string; sawOriginalOn?: string }) =>
    api.post<CertificateView>(`/certificates/${id}/verify`, body),
  rejectCertificate: (id: string, reason: string) => api.post<CertificateView>(`/certificates/${id}/reject`, { reason }),
  verify: (code: string) => api.get<VerificationView>(`/verify/${encodeURIComponent(code)}`, undefined, { allowUnauthorized: true }),
};
