import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger } from '@nestjs/common';
import type { Request, Response } from 'express';
import { ZodValidationException } from 'nestjs-zod';
import { ZodError } from 'zod';

interface ErrorBody {
  message: string;
  errors?: { path: string; message: string }[];
  correlationId?: string;
}

/**
 * Errors raised by Express middleware before Nest sees the request (body-parser's "request entity too
 * large", a JSON body that does not parse) follow the http-errors convention: a 4xx `status` and
 * `expose: true` when the message is meant for the caller.
 */
function clientErrorOf(exception: unknown): { status: number; message: string } | null {
  if (typeof exception !== 'object' || exception === null) return null;
  const { status, expose, message } = exception as { status?: unknown; expose?: unknown; message?: unknown };
  if (typeof status !== 'number' || status < 400 || status > 499 || expose !== true) return null;
  return { status, message: typeof message === 'string' ? message : 'The request cannot be read' };
}

function zodErrors(error: ZodError) {
  return error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}

/**
 * The one exception filter: validation failures become 400 `{ message, errors }`, HTTP errors keep their
 * status and message, and anything unexpected is logged with a correlation id and answered with a 500
 * that reveals nothing but that id.
 */
@Catch()
export class AllExceptionsFilter implements ExceptionFilter {
  private readonly logger = new Logger('Unhandled');

  catch(exception: unknown, host: ArgumentsHost) {
    const http = host.switchToHttp();
    const res = http.getResponse<Response>();
    const req = http.getRequest<Request & { id?: string }>();
    const { status, body } = this.describe(exception, req.id);
    if (res.headersSent) return;
    res.status(status).json(body);
  }

  private describe(exception: unknown, correlationId?: string): { status: number; body: ErrorBody } {
    if (exception instanceof ZodValidationException) {
      const zodError = exception.getZodError();
      return {
        status: HttpStatus.BAD_REQUEST,
        body: {
          message: 'The request is not valid',
          errors: zodError instanceof ZodError ? zodErrors(zodError) : [],
        },
      };
    }
    if (exception instanceof ZodError) {
      return {
        status: HttpStatus.BAD_REQUEST,
        body: { message: 'The request is not valid', errors: zodErrors(exception) },
      };
    }
    if (exception instanceof HttpException) {
      const response = exception.getResponse();
      const message =
        typeof response === 'string'
          ? response
          : String((response as { message?: unknown }).message ?? exception.message);
      const errors = typeof response === 'object' ? (response as ErrorBody).errors : undefined;
      return { status: exception.getStatus(), body: errors ? { message, errors } : { message } };
    }
    const clientError = clientErrorOf(exception);
    if (clientError) {
      const message =
        clientError.status === HttpStatus.PAYLOAD_TOO_LARGE
          ? `The request body is too large (${clientError.message})`
          : clientError.message;
      return { status: clientError.status, body: { message } };
    }
    this.logger.error(
      `[${correlationId}] ${exception instanceof Error ? (exception.stack ?? exception.message) : String(exception)}`,
    );
    return {
      status: HttpStatus.INTERNAL_SERVER_ERROR,
      body: { message: 'Something went wrong on our side. Quote this id when reporting it.', correlationId },
    };
  }
}
