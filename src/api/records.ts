import type { Page } from '@shared/schemas/common';
import type { EntryBody, OpenSignoffBody, SignoffListQuery } from '@shared/schemas/signoffs';
import type { CircuitInput, Outcome, PracticalListQuery } from '@shared/schemas/practicals';
import type { PracticalRowView, PracticalView, RecordItemView, SignoffRowView, SignoffView } from '@shared/practicals/views';
import type { ScopeView } from '@shared/authorisations/views';
import { api } from './client';

export type { EntryBody, PracticalRowView, PracticalView, RecordItemView, SignoffRowView, SignoffView, CircuitInput, Outcome };

export interface OpenPracticalInput {
  technicianId: string;
  benchId: string;
  procedureId: string;
  versionId: string;
  checklistId?: string;
  scopeId?: string | null;
  instrumentIds: string[];
  circuit: CircuitInput;
  /** Needed when the bench is at another site than the technician's. */
  crossSiteReason?: string | null;
}
export interface Candidate { id: string; name: string; email: string; siteId: string }

/** Sign-offs: a person's own checklists and bench pre-use checks, and the countersignature. */
export const signoffsApi = {
  list: (query: Partial<SignoffListQuery>) => api.get<Page<SignoffRowView>>('/signoffs', { ...query }),
  open: (body: OpenSignoffBody) => api.post<SignoffView>('/signoffs', body),
  get: (id: string) => api.get<SignoffView>(`/signoffs/${id}`),
  save: (id: string, itemId: string, body: EntryBody) => api.put<SignoffView>(`/signoffs/${id}/items/${itemId}`, body),
  submit: (id: string, password: string, recordAsFailed = false) => api.post<SignoffView>(`/signoffs/${id}/submit`, { password, recordAsFailed }),
  countersign: (id: string, password: string) => api.post<SignoffView>(`/signoffs/${id}/countersign`, { password }),
  returnIt: (id: string, comment: string) => api.post<SignoffView>(`/signoffs/${id}/return`, { comment }),
  correct: (id: string, reason: string) => api.post<SignoffView>(`/signoffs/${id}/corrections`, { reason }),
};

/** Supervised practicals at the bench. */
export const practicalsApi = {
  list: (query: Partial<PracticalListQuery>) => api.get<Page<PracticalRowView>>('/practicals', { ...query }),
  technicians: (q?: string) => api.get<{ items: Candidate[] }>('/practicals/technicians', { q }),
  scopes: () => api.get<ScopeView[]>('/scopes'),
  open: (body: OpenPracticalInput) => api.post<PracticalView>('/practicals', body),
  get: (id: string) => api.get<PracticalView>(`/practicals/${id}`),
  save: (id: string, itemId: string, body: EntryBody) => api.put<PracticalView>(`/practicals/${id}/items/${itemId}`, body),
  witness: (id: string, stepKey: string, note?: string) => api.post<PracticalView>(`/practicals/${id}/hold-points/${stepKey}`, { note: note || null }),
  assess: (id: string, body: { outcome: Outcome; comment: string; password: string }) => api.post<PracticalView>(`/practicals/${id}/assess`, body),
  acknowledge: (id: string, technician: string, password: string) => api.post<PracticalView>(`/practicals/${id}/acknowledge`, { technician, password }),
  correct: (id: string, reason: string) => api.post<PracticalView>(`/practicals/${id}/corrections`, { reason }),
};
