/** An error with an HTTP status and a message meant for the user (and optional field errors). */
export class HttpError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly details?: { fields?: Record<string, string[]>; code?: string; [k: string]: unknown },
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, fields?: Record<string, string[]>) => new HttpError(400, message, { fields });
export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, message);
export const forbidden = (message: string) => new HttpError(403, message);
export const notFound = (what: string) => new HttpError(404, `${what} not found.`);
export const conflict = (message: string) => new HttpError(409, message);
export const unavailable = (message: string) => new HttpError(503, message);
