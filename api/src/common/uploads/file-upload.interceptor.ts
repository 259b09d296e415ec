import { BadRequestException, Injectable, mixin, PayloadTooLargeException, UnsupportedMediaTypeException, type CallHandler, type ExecutionContext, type NestInterceptor, type Type } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import type { Request } from 'express';
import path from 'node:path';

/** What an upload may be: the file name's extension and the types browsers and tools send for it. */
export const UPLOAD_KINDS = {
  csv: { extensions: ['.csv', '.txt'], mimetypes: ['text/csv', 'application/vnd.ms-excel', 'text/plain', 'application/csv'], label: 'a CSV file (.csv)' },
  json: { extensions: ['.json'], mimetypes: ['application/json', 'text/plain'], label: 'a JSON file (.json)' },
} as const;
export type UploadKind = keyof typeof UPLOAD_KINDS;

/** The longest text field beside a file (the scan settings' JSON is the longest there is). */
const FIELD_MAX_BYTES = 64 * 1024;

/** Multer's refusals that concern one field, in the words people read. */
const MULTER_FIELD_PROBLEMS: Record<string, string> = {
  LIMIT_FIELD_VALUE: `the value is longer than ${formatBytes(FIELD_MAX_BYTES)}`,
  LIMIT_FIELD_KEY: 'the field name is too long',
  LIMIT_UNEXPECTED_FILE: 'a file was sent in a field that takes none (or more than one file)',
  LIMIT_FILE_COUNT: 'send one file only',
};

/**
 * Multer's 400s name the field at the end ("Field value too long - spec"); ours lead with it and
 * carry it in fieldErrors, like every other 400. Null for errors that are not about one field.
 */
function multipartFieldError(error: unknown): BadRequestException | null {
  if (!(error instanceof BadRequestException)) return null;
  const { code, field } = (error.cause ?? {}) as { code?: unknown; field?: unknown };
  const reason = typeof code === 'string' ? MULTER_FIELD_PROBLEMS[code] : undefined;
  if (!reason || typeof field !== 'string' || field === '') return null;
  return new BadRequestException({ message: `${field}: ${reason}`, fieldErrors: { [field]: [reason] } });
}

/** "5 MB", "256 kB": limits as people read them. */
export function formatBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${+(bytes / 1024 / 1024).toFixed(1)} MB` : `${+(bytes / 1024).toFixed(1)} kB`;
}

/**
 * Multer's FileInterceptor for one file in `field`, kept in memory up to `maxBytes` (past that a
 * 413 that says the limit), of `kind` by extension and type (else a 415). Text fields beside the
 * file end up in req.body as strings.
 */
export function FileUpload(field: string, kind: UploadKind, maxBytes: number): Type<NestInterceptor> {
  const allowed = UPLOAD_KINDS[kind];
  const Multer = FileInterceptor(field, {
    limits: { fileSize: maxBytes, files: 1, fields: 20, fieldSize: FIELD_MAX_BYTES },
    fileFilter: (_req: Request, file: Express.Multer.File, accept: (error: Error | null, ok: boolean) => void) => {
      const extension = path.extname(file.originalname).toLowerCase();
      if (!(allowed.extensions as readonly string[]).includes(extension) || !(allowed.mimetypes as readonly string[]).includes(file.mimetype)) {
        accept(new UnsupportedMediaTypeException(`${file.originalname} (${file.mimetype}) is not ${allowed.label}`), false);
      } else {
        accept(null, true);
      }
    },
  });

  @Injectable()
  class LimitedFileUpload extends Multer {
    override async intercept(context: ExecutionContext, next: CallHandler) {
      try {
        return await super.intercept(context, next);
      } catch (error) {
        if (error instanceof PayloadTooLargeException) {
          throw new PayloadTooLargeException(`The file is larger than the limit of ${formatBytes(maxBytes)}`);
        }
        throw multipartFieldError(error) ?? error;
      }
    }
  }
  return mixin(LimitedFileUpload);
}
