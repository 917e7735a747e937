import type { Page } from '@shared/schemas/common';
import type { EvidenceEntity, EvidenceQuery, EvidenceRow } from '@shared/schemas/evidence';
import { api } from './client';

export type { EvidenceRow, EvidenceEntity, EvidenceQuery };

export interface EvidenceUploadInput {
  file: File;
  entity: EvidenceEntity;
  entityId?: string;
  ownerId?: string;
  caption?: string;
}

export const evidenceApi = {
  list: (query: Partial<EvidenceQuery>) => api.get<Page<EvidenceRow>>('/evidence', { ...query }),
  get: (id: string) => api.get<EvidenceRow>(`/evidence/${id}`),
  upload(input: EvidenceUploadInput) {
    const form = new FormData();
    form.set('entity', input.entity);
    if (input.entityId) form.set('entityId', input.entityId);
    if (input.ownerId) form.set('ownerId', input.ownerId);
    if (input.caption?.trim()) form.set('caption', input.caption.trim());
    form.set('file', input.file, input.file.name);
    return api.postForm<EvidenceRow>('/evidence', form);
  },
};
