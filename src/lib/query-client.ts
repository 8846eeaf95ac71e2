import { MutationCache, QueryCache, QueryClient } from "@tanstack/react-query";
import { ApiError } from "./api-client.ts";
import { rootKeys } from "./query-keys.ts";

/** When the session has expired, any 401 marks the user signed out; the layout then sends them to sign-in (and back). */
export function createQueryClient() {
  const onError = (error: Error) => {
    if (error instanceof ApiError && error.status === 401) client.setQueryData(rootKeys.me, null);
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError: (e) => onError(e) }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
      },
    },
  });
  return client;
}
