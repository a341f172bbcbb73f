/** The one error type routes and services throw: an HTTP status and a message a user can read. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what = 'Not found') => new AppError(404, what);
export const badRequest = (message: string, details?: unknown) => new AppError(400, message, details);
export const unauthorised = () => new AppError(401, 'Sign in first');
export const forbidden = (reason: string) => new AppError(403, reason);
