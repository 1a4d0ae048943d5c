import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors';
import type { Logger } from '../logger';

interface BodyParserError { type?: string; status?: number }

/** The one error middleware, mounted last: never a stack trace to the client. */
export function errorHandler(logger: Logger) {
  return (err: unknown, req: Request, res: Response, _next: NextFunction) => {
    if (res.headersSent) {
      req.socket.destroy();
      return;
    }
    if (err instanceof AppError) {
      res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } });
      return;
    }
    const bp = err as BodyParserError;
    if (bp?.type === 'entity.too.large') {
      res.status(413).json({ error: { code: 'too_large', message: 'The request body is too large.' } });
      return;
    }
    if (bp?.type === 'entity.parse.failed') {
      res.status(400).json({ error: { code: 'invalid_json', message: 'The request body is not valid JSON.' } });
      return;
    }
    const requestId = res.getHeader('x-request-id');
    logger.error({ err, requestId, method: req.method, path: req.path }, 'unexpected error');
    res.status(500).json({ error: { code: 'internal', message: `Something went wrong on our side. Quote request ${requestId} if you contact support.`, requestId } });
  };
}
