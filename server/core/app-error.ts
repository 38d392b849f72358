/** An error the API reports to the caller as `{ error: { code, message, fields? } }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }

  static notFound(what = 'That record'): AppError {
    return new AppError(404, 'not_found', `${what} was not found.`);
  }

  static conflict(message: string): AppError {
    return new AppError(409, 'conflict', message);
  }
}
