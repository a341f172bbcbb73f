import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OpenApiDocument } from '@shared/schemas/openapi';
import { api } from '@frontend/lib/api-client';

/** The server's own API description (public, the same for every organisation); it changes only with a new version. */
export const openApiQueryOptions = () =>
  queryOptions({
    queryKey: ['openapi'],
    queryFn: () => api<OpenApiDocument>('/api/openapi.json'),
    staleTime: Infinity,
  });

export const useOpenApi = () => useQuery(openApiQueryOptions());
