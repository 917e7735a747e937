/** The one error type: the error middleware turns it into `{ error: { code, message, fields } }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) => new AppError(400, 'bad_request', message, fields);
export const unauthorized = (message = 'Sign in first.') => new AppError(401, 'unauthorized', message);
export const forbidden = (message = 'You may not do this.') => new AppError(403, 'forbidden', message);
export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, fields?: Record<string, string>) => new AppError(409, 'conflict', message, fields);
export const unprocessable = (message: string, fields?: Record<string, string>) =>
  new AppError(422, 'unprocessable', message, fields);
