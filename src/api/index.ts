export { api, ApiError, isApiError, setUnauthorizedHandler } from './client';
export { sessionApi, type SessionUser } from './session';
export { passwordApi, type PasswordLink } from './password';
export { sitesApi, type Site } from './sites';
export { peopleApi, type Person, type PersonRow, type PeopleQuery, type InviteBody, type UpdatePersonBody } from './people';
export { mailApi, type MailRow, type MailMessage } from './mail';
