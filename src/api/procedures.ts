import type { Page } from '@shared/schemas/common';
import type { AckTableQuery, CreateProcedureBody, ProcedureListQuery, SaveDraftInput } from '@shared/schemas/procedures';
import type { ProcedureRowView, ProcedureView, SignatureView, VersionView } from '@shared/procedures/views';
import type { AckRowView, CompareView, ImpactView } from '@shared/procedures/reports';
import { api } from './client';

export type { ProcedureRowView, ProcedureView, VersionView, SignatureView, AckRowView, CompareView, ImpactView, SaveDraftInput };

const v = (id: string, versionId: string) => `/procedures/${id}/versions/${versionId}`;

/** Everything the procedures pages ask of the server. */
export const proceduresApi = {
  list: (query: Partial<ProcedureListQuery>) => api.get<Page<ProcedureRowView>>('/procedures', { ...query }),
  create: (body: CreateProcedureBody) => api.post<VersionView>('/procedures', body),
  get: (id: string) => api.get<ProcedureView>(`/procedures/${id}`),
  version: (id: string, versionId: string) => api.get<VersionView>(v(id, versionId)),
  newDraft: (id: string) => api.post<VersionView>(`/procedures/${id}/versions`),
  save: (id: string, versionId: string, body: SaveDraftInput) => api.put<VersionView>(v(id, versionId), body),
  submit: (id: string, versionId: string) => api.post<VersionView>(`${v(id, versionId)}/submit`),
  returnToDraft: (id: string, versionId: string, comment: string) => api.post<VersionView>(`${v(id, versionId)}/return`, { comment }),
  approve: (id: string, versionId: string, password: string) => api.post<VersionView>(`${v(id, versionId)}/approve`, { password }),
  withdraw: (id: string, versionId: string, reason: string) => api.post<VersionView>(`${v(id, versionId)}/withdraw`, { reason }),
  impact: (id: string, versionId: string) => api.get<ImpactView>(`${v(id, versionId)}/impact`),
  acknowledge: (id: string, versionId: string, password: string) => api.post<{ acknowledgement: SignatureView }>(`${v(id, versionId)}/acknowledge`, { password }),
  compare: (id: string, from: string, to: string) => api.get<CompareView>(`/procedures/${id}/compare`, { from, to }),
  acknowledgements: (id: string, query: Partial<AckTableQuery>) =>
    api.get<Page<AckRowView> & { inForce: { versionId: string; number: number } | null }>(`/procedures/${id}/acknowledgements`, { ...query }),
  extend: (id: string, userId: string, body: { dueOn: string; reason: string }) => api.post<{ dueOn: string }>(`/procedures/${id}/acknowledgements/${userId}/extension`, body),
  pdfUrl: (id: string, versionId: string) => `/api${v(id, versionId)}/pdf`,
};
