import { applyDecorators } from '@nestjs/common';
import { ApiBody, ApiConsumes, ApiQuery, ApiResponse, type SchemaObject } from '@nestjs/swagger';
import { apiErrorSchema } from '@sixtyfold/shared';
import { z } from 'zod';

/**
 * The OpenAPI form of a shared zod schema, so the document describes exactly what the
 * ZodValidationPipe accepts and what the services answer. Requests are described by what may be
 * sent (`input`: fields with defaults are optional), answers by what comes back (`output`).
 * Refinements (cross-field rules) have no JSON Schema form; the API still enforces them.
 */
export function openApiSchemaOf(schema: z.ZodType, io: 'input' | 'output'): SchemaObject {
  return z.toJSONSchema(schema, { target: 'openapi-3.0', io, unrepresentable: 'any' }) as SchemaObject;
}

/** Documents a JSON request body with a shared schema. */
export const ApiZodBody = (schema: z.ZodType, description?: string) =>
  ApiBody({ schema: openApiSchemaOf(schema, 'input'), description, required: true });

/** Documents each field of a shared query schema as a query parameter. */
export function ApiZodQuery(schema: z.ZodType) {
  const object = openApiSchemaOf(schema, 'input');
  const required = new Set(object.required ?? []);
  return applyDecorators(
    ...Object.entries(object.properties ?? {}).map(([name, property]) =>
      ApiQuery({ name, required: required.has(name), schema: property as SchemaObject, description: (property as SchemaObject).description }),
    ),
  );
}

/** Documents a JSON answer with a shared schema. */
export const ApiZodResponse = (status: number, schema: z.ZodType, description: string) =>
  ApiResponse({ status, description, schema: openApiSchemaOf(schema, 'output') });

const errorDescriptions: Record<number, string> = {
  400: 'Bad input: `message` names every bad field, `fieldErrors` maps each to its problems',
  401: 'No session, or a missing, unknown, revoked or expired API token',
  403: 'Signed in, but the role (or the way of signing in) does not allow this',
  404: 'No such object, or it belongs to a group you are not in',
  409: 'The object is not in a state that allows this',
  410: 'The link has expired, was revoked or was already used',
  502: 'The mail server refused the message; nothing was saved',
  413: 'The uploaded file is larger than the limit the message names',
  415: 'The uploaded file is not of the type the route reads',
  429: 'A limit was reached (too many sign-ins, e-mails or downloads at once; the message says which); `Retry-After` gives the seconds to wait where it applies',
  503: 'The server is busy (no database connection came free in time, or too many password checks waiting) or not ready; try again in a moment',
};

/** Documents the error answers a route can give; all share the ApiError body. */
export const ApiErrorResponses = (...statuses: (keyof typeof errorDescriptions)[]) =>
  applyDecorators(...statuses.map((status) => ApiZodResponse(status, apiErrorSchema, errorDescriptions[status])));

/** Documents a multipart upload: the text fields of a shared schema plus the file in `fileField`. */
export function ApiZodMultipart(fields: z.ZodType | undefined, fileField: string, description: string) {
  const object = fields ? openApiSchemaOf(fields, 'input') : { type: 'object' as const, properties: {}, required: [] as string[] };
  return applyDecorators(
    ApiConsumes('multipart/form-data'),
    ApiBody({
      description,
      required: true,
      schema: {
        ...object,
        properties: { ...(object.properties ?? {}), [fileField]: { type: 'string', format: 'binary' } },
        required: [...(object.required ?? []), fileField],
      },
    }),
  );
}
