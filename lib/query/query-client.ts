import { QueryClient, isServer } from "@tanstack/react-query";

function isAuthError(error: unknown): boolean {
  const status = (error as { status?: number } | null)?.status;
  return status === 401 || status === 403;
}

/** One QueryClient shape for server and browser (for a screen that wraps itself in QueryClientProvider): cached for a minute, no retries on 401/403. */
export function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 60_000,
        retry: (count, error) => !isAuthError(error) && count < 2,
        networkMode: "offlineFirst",
      },
    },
  });
}

let browserClient: QueryClient | undefined;

/** A new client per server request; a singleton in the browser. */
export function getQueryClient(): QueryClient {
  if (isServer) return makeQueryClient();
  return (browserClient ??= makeQueryClient());
}
