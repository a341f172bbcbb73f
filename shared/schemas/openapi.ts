import { z } from 'zod';

/** The outline of the API description a script reads; the operations themselves are JSON Schema, left open. */
export const openApiDocument = z
  .object({
    openapi: z.literal('3.1.0'),
    info: z.object({ title: z.string(), version: z.string(), description: z.string() }).strict(),
    jsonSchemaDialect: z.string(),
    paths: z.record(z.string(), z.partialRecord(z.enum(['get', 'post', 'put', 'patch', 'delete']), z.record(z.string(), z.unknown()))),
    components: z.object({ schemas: z.record(z.string(), z.unknown()), securitySchemes: z.record(z.string(), z.unknown()) }).strict(),
  })
  .strict();
export type OpenApiDocument = z.infer<typeof openApiDocument>;
