import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError } from '../errors';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
};

/** Every failure leaves as the one JSON error shape; unexpected ones are logged and never leak a stack. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let error: HttpError;
  if (err instanceof HttpError) {
    error = err;
  } else if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.parse.failed') {
    error = new HttpError(400, 'malformed_json', 'The request body is not valid JSON.');
  } else if (err && typeof err === 'object' && 'type' in err && err.type === 'entity.too.large') {
    error = new HttpError(413, 'too_large', 'The request body is too large.');
  } else if (err instanceof URIError) {
    // A path such as /api/characters/%ZZ: its percent-encoding cannot be decoded (RFC 3986 §2.1).
    error = new HttpError(400, 'bad_path', 'The address has a part that is not valid percent-encoding. Check the link.');
  } else {
    req.log?.error({ err }, 'unhandled error');
    error = new HttpError(500, 'internal', 'Something went wrong on our side. Nothing was changed; try again.');
  }
  res.status(error.status).json({
    error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) },
  });
};
