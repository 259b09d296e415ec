import { type ArgumentsHost, Catch, type ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import { STATUS_CODES } from 'node:http';
import type { Response } from 'express';
import type { ApiError } from '@sixtyfold/shared';

/**
 * Every error leaves the API as an ApiError body. Client mistakes keep their status and say
 * what was wrong; anything unexpected is logged and answered with a plain 500.
 */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('ApiExceptionFilter');

  catch(exception: unknown, host: ArgumentsHost): void {
    const res = host.switchToHttp().getResponse<Response>();
    const body = this.toBody(exception);
    // A 503 is a deliberate "busy" or "not ready" answer, not a fault; a flood of them must not flood the log.
    if (body.statusCode >= 500 && body.statusCode !== HttpStatus.SERVICE_UNAVAILABLE) {
      this.logger.error(exception instanceof Error ? exception.stack ?? exception.message : String(exception));
    }
    if (res.headersSent) return;
    // A refusal that ends by itself (429, 503) may say when: HttpException({ message, retryAfter }).
    const retryAfter = exception instanceof HttpException ? (exception.getResponse() as { retryAfter?: unknown }).retryAfter : undefined;
    if (typeof retryAfter === 'number') res.setHeader('Retry-After', String(retryAfter));
    res.status(body.statusCode).json(body);
  }

  private toBody(exception: unknown): ApiError {
    // Nest wraps body-parser's errors (malformed JSON, too large) in an HttpException with the
    // original as its cause; either way the answer says what was wrong with the body.
    const parserError = exception instanceof HttpException ? exception.cause : exception;
    const parserMessage = bodyParserMessage(parserError);
    if (parserMessage) {
      const statusCode = (parserError as { status: number }).status;
      return { statusCode, error: STATUS_CODES[statusCode] ?? 'Error', message: parserMessage };
    }
    if (exception instanceof HttpException) {
      const statusCode = exception.getStatus();
      const response = exception.getResponse();
      const raw = typeof response === 'string' ? { message: response } : (response as Record<string, unknown>);
      const message = Array.isArray(raw.message) ? raw.message.join('; ') : String(raw.message ?? exception.message);
      const body: ApiError = { statusCode, error: STATUS_CODES[statusCode] ?? 'Error', message };
      if (raw.fieldErrors) body.fieldErrors = raw.fieldErrors as Record<string, string[]>;
      if (typeof raw.line === 'number') body.line = raw.line;
      return body;
    }
    // Other http-errors with a client status (from Express itself) keep it.
    const status = (exception as { status?: unknown })?.status;
    if (typeof status === 'number' && status >= 400 && status < 500) {
      return { statusCode: status, error: STATUS_CODES[status] ?? 'Error', message: (exception as Error).message };
    }
    return {
      statusCode: HttpStatus.INTERNAL_SERVER_ERROR,
      error: 'Internal Server Error',
      message: 'Something went wrong on our side; the error was logged. Try again, and tell the maintainer if it persists.',
    };
  }
}

/** body-parser's refusals (a 4xx `status` and a `type`) as a sentence about the body; null for any other error. */
export function bodyParserMessage(error: unknown): string | null {
  const { status, type, message } = (error ?? {}) as { status?: unknown; type?: unknown; message?: unknown };
  if (typeof status !== 'number' || status < 400 || status >= 500) return null;
  // The parser's own reason names the position, e.g. "Unexpected token } in JSON at position 12".
  if (type === 'entity.parse.failed') return `The request body is not valid JSON: ${String(message)}`;
  if (type === 'entity.too.large') return 'The request body is too large';
  return null;
}
