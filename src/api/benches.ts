import type { Page } from '@shared/schemas/common';
import type { EquipmentFlag } from '@shared/schemas/equipment-common';
import type { BenchBody, BenchesQuery, BenchRow, BenchUpdateBody, PreUseCheck } from '@shared/schemas/benches';
import type { InstrumentBody, InstrumentRow, InstrumentsQuery, InstrumentUpdateBody } from '@shared/schemas/instruments';
import type { TypeAcDecisionBody, TypeAcDecisionView } from '@shared/schemas/bench-decisions';
import { api } from './client';

export type { BenchBody, BenchRow, BenchUpdateBody, BenchesQuery, PreUseCheck, InstrumentBody, InstrumentRow, InstrumentUpdateBody, InstrumentsQuery, EquipmentFlag };

export type { TypeAcDecisionView };
export interface BenchUsability { usable: true; bench: BenchRow; warnings: EquipmentFlag[]; typeAcDecision: TypeAcDecisionView | null }
export interface InstrumentUsability { usable: true; instrument: InstrumentRow; warnings: EquipmentFlag[] }

export const benchesApi = {
  list: (query: Partial<BenchesQuery>) => api.get<Page<BenchRow>>('/benches', { ...query }),
  get: (id: string) => api.get<BenchRow>(`/benches/${id}`),
  create: (body: BenchBody) => api.post<BenchRow>('/benches', body),
  update: (id: string, body: BenchUpdateBody) => api.patch<BenchRow>(`/benches/${id}`, body),
  usability: (id: string) => api.get<BenchUsability>(`/benches/${id}/usability`),
  typeAcDecisions: (id: string) => api.get<{ items: TypeAcDecisionView[] }>(`/benches/${id}/type-ac-decisions`),
  acceptTypeAc: (id: string, body: TypeAcDecisionBody) => api.post<TypeAcDecisionView>(`/benches/${id}/type-ac-decisions`, body),
  checks: (id: string, page = 1, pageSize = 10) => api.get<Page<PreUseCheck>>(`/benches/${id}/pre-use-checks`, { page, pageSize }),
  recordCheck: (id: string, body: { passed: boolean; notes: string | null; password: string }) => api.post<PreUseCheck>(`/benches/${id}/pre-use-checks`, body),
};

export const instrumentsApi = {
  list: (query: Partial<InstrumentsQuery>) => api.get<Page<InstrumentRow>>('/instruments', { ...query }),
  get: (id: string) => api.get<InstrumentRow>(`/instruments/${id}`),
  create: (body: InstrumentBody) => api.post<InstrumentRow>('/instruments', body),
  update: (id: string, body: InstrumentUpdateBody) => api.patch<InstrumentRow>(`/instruments/${id}`, body),
  usability: (id: string, voltage?: number) => api.get<InstrumentUsability>(`/instruments/${id}/usability`, { voltage }),
};
