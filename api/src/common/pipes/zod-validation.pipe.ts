import { BadRequestException, type PipeTransform } from '@nestjs/common';
import type { z } from 'zod';

/** Turns zod issues into a 400 whose message names every bad field, with a per-field map for forms. */
export function zodBadRequest(error: z.ZodError): BadRequestException {
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (fieldErrors[key] ??= []).push(issue.message);
  }
  const message = Object.entries(fieldErrors)
    .map(([field, messages]) => (field === '_' ? messages.join('; ') : `${field}: ${messages.join('; ')}`))
    .join('. ');
  return new BadRequestException({ message, fieldErrors });
}

/** Validates and normalises a body or query with one of the shared schemas. */
export class ZodValidationPipe<T extends z.ZodType> implements PipeTransform<unknown, z.infer<T>> {
  constructor(private readonly schema: T) {}

  transform(value: unknown): z.infer<T> {
    const result = this.schema.safeParse(value ?? {});
    if (!result.success) throw zodBadRequest(result.error);
    return result.data;
  }
}
