import { Injectable, mixin, PayloadTooLargeException, UnsupportedMediaTypeException, type CallHandler, type ExecutionContext, type NestInterceptor, type Type } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import type { Request } from 'express';
import path from 'node:path';

/** What an upload may be: the file name's extension and the types browsers and tools send for it. */
export const UPLOAD_KINDS = {
  csv: { extensions: ['.csv', '.txt'], mimetypes: ['text/csv', 'application/vnd.ms-excel', 'text/plain', 'application/csv'], label: 'a CSV file (.csv)' },
  json: { extensions: ['.json'], mimetypes: ['application/json', 'text/plain'], label: 'a JSON file (.json)' },
} as const;
export type UploadKind = keyof typeof UPLOAD_KINDS;

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
    limits: { fileSize: maxBytes, files: 1, fields: 20, fieldSize: 64 * 1024 },
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
        throw error;
      }
    }
  }
  return mixin(LimitedFileUpload);
}
