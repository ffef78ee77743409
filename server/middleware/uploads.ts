/**
 * Multipart uploads with a cap on the request as a whole, enforced while it streams. multer's limits bound the
 * count of files, fields and parts and each field's size; a storage engine that counts every byte it keeps bounds
 * the total: past the cap it stops keeping bytes, and the person is answered at once while the rest of the body is
 * read and dropped (so browsers see the answer instead of a reset connection). A request that declares a larger
 * Content-Length is answered before a byte of its body is read.
 */
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from '../errors';
import { refuse } from '../services/gltf-import-refusals';

export interface UploadLimits {
  /** All files of one request together. */
  maxBytes: number;
  maxFiles: number;
  maxFields: number;
  /** Bytes of one text field's value. */
  maxFieldBytes: number;
  /** Requests that are not multipart pass through untouched (the route also takes JSON). */
  optional?: boolean;
}

/** Room for the multipart framing and the text fields on top of the files (the Content-Length check). */
const FORM_OVERHEAD_BYTES = 256 * 1024;
const FIELD = 'file';

const mb = (bytes: number) => `${(bytes / 1048576).toFixed(bytes < 1048576 ? 1 : 0)} MB`;

interface Budget {
  used: number;
  overflow(err: HttpError): void;
}

const budgets = new WeakMap<Request, Budget>();

function tooLarge(limit: number): HttpError {
  return refuse('too_large', `The upload is larger than ${mb(limit)}, the limit for all files of one upload together. Reduce textures or export without them.`);
}

/** multer's memory storage, but every byte kept counts against the request's budget. */
function countingMemoryStorage(limit: number): multer.StorageEngine {
  return {
    _handleFile(req, file, cb) {
      const budget = budgets.get(req as Request);
      const chunks: Buffer[] = [];
      let size = 0;
      let finished = false;
      const finish = (err: Error | null, info?: Partial<Express.Multer.File>) => {
        if (finished) return;
        finished = true;
        cb(err, info);
      };
      file.stream.on('data', (chunk: Buffer) => {
        if (finished) return;
        size += chunk.length;
        if (budget) budget.used += chunk.length;
        if ((budget?.used ?? size) > limit) {
          chunks.length = 0;
          const err = tooLarge(limit);
          budget?.overflow(err);
          finish(err);
          return;
        }
        chunks.push(chunk);
      });
      file.stream.on('end', () => finish(null, { buffer: Buffer.concat(chunks, size), size }));
      file.stream.on('error', (err) => finish(err));
    },
    _removeFile(_req, file, cb) {
      (file as { buffer?: Buffer }).buffer = undefined;
      cb(null);
    },
  };
}

function multerRefusal(err: unknown, limits: UploadLimits): HttpError {
  if (err instanceof HttpError) return err;
  if (err instanceof multer.MulterError) {
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return tooLarge(limits.maxBytes);
      case 'LIMIT_FILE_COUNT':
        return refuse('too_many_files', `Send at most ${limits.maxFiles} files: the .gltf with its .bin and images, or one .glb.`);
      case 'LIMIT_UNEXPECTED_FILE':
        return refuse('no_file', `Send the files in the form field "${FIELD}".`);
      case 'LIMIT_FIELD_VALUE':
        return new HttpError(400, 'bad_upload', `The form field "${err.field}" is longer than ${limits.maxFieldBytes} bytes.`, { [err.field ?? 'form']: 'This is too long.' });
      case 'LIMIT_FIELD_COUNT':
      case 'LIMIT_PART_COUNT':
        return new HttpError(400, 'bad_upload', `The upload has more form fields than the ${limits.maxFields} this form takes.`, { file: 'Send only the file and its form fields.' });
      default:
        return new HttpError(400, 'bad_upload', `The upload could not be read (${err.message}).`, { file: 'Send the file again.' });
    }
  }
  return new HttpError(400, 'bad_upload', 'The upload is not a complete multipart form. Try again.', { file: 'Send the file again.' });
}

/** The upload parser for one route: files in the field "file", memory held for at most `maxBytes` of them. */
export function uploadParser(limits: UploadLimits): RequestHandler {
  const parse = multer({
    storage: countingMemoryStorage(limits.maxBytes),
    // busboy decodes a part's filename as latin1 unless told otherwise; browsers send UTF-8 (WHATWG HTML, multipart/form-data).
    defParamCharset: 'utf8',
    limits: {
      fileSize: limits.maxBytes,
      files: limits.maxFiles,
      fields: limits.maxFields,
      fieldSize: limits.maxFieldBytes,
      fieldNameSize: 100,
      parts: limits.maxFiles + limits.maxFields,
      headerPairs: 20,
    },
  }).array(FIELD, limits.maxFiles);
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      return limits.optional ? next() : next(refuse('no_file', `Send the character as multipart/form-data, the files in the field "${FIELD}".`));
    }
    const declared = Number(req.headers['content-length']);
    if (Number.isFinite(declared) && declared > limits.maxBytes + FORM_OVERHEAD_BYTES) return next(tooLarge(limits.maxBytes));
    let answered = false;
    const answer = (err?: HttpError) => {
      if (answered) return;
      answered = true;
      next(err);
    };
    budgets.set(req, { used: 0, overflow: answer });
    parse(req, res, (err: unknown) => answer(err ? multerRefusal(err, limits) : undefined));
  };
}
