export { api, ApiError, isApiError, setUnauthorizedHandler } from './client';
export { sessionApi, type SessionUser } from './session';
export { passwordApi, type PasswordLink } from './password';
export { sitesApi, type Site } from './sites';
export { peopleApi, type Person, type PersonRow, type PeopleQuery, type InviteBody, type UpdatePersonBody } from './people';
export { mailApi, type MailRow, type MailMessage, type MailPage, type MailStatus } from './mail';
export { benchesApi, instrumentsApi, type BenchRow, type BenchBody, type BenchUpdateBody, type BenchesQuery, type PreUseCheck, type InstrumentRow, type InstrumentBody, type InstrumentUpdateBody, type InstrumentsQuery, type EquipmentFlag } from './benches';
export { evidenceApi, type EvidenceRow, type EvidenceEntity, type EvidenceUploadInput } from './evidence';
