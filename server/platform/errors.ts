/** Every error the API answers with: a status, a stable code and a message a person can act on. */
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const invalidInput = (fields: Record<string, string>, message = 'Some fields need attention.') =>
  new AppError(400, 'invalid_input', message, fields);
export const badRequest = (code: string, message: string) => new AppError(400, code, message);
export const unauthenticated = (message = 'Please sign in.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'That record') => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (code: string, message: string) => new AppError(409, code, message);
export const paymentFailed = (code: string, message: string) => new AppError(402, code, message);
export const tooLarge = (message = 'The upload is too large.') => new AppError(413, 'too_large', message);
export const throttled = (message: string) => new AppError(429, 'throttled', message);
export const badGateway = (code: string, message: string) => new AppError(502, code, message);
