// NIST SP 800-63B rev. 4, 3.1.1.2, for a password used as the only factor: at least 15 characters,
// at least 64 allowed. Kept free of zod so client pages that only show the rules stay small.
export const PASSWORD_MIN = 15;
export const PASSWORD_MAX = 128;
