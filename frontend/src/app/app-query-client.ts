import { createQueryClient } from '@frontend/lib/query-client';

/** The app's one QueryClient, shared by route loaders (which run before React renders) and components. */
export const appQueryClient = createQueryClient();
