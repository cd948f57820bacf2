/**
 * TanStack Query: in the browser one client per page, shared by every island on it. On the server
 * every render gets a new client: a client kept by the process would carry one person's data (an
 * island's initial data) into the page of the next.
 */
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ApiError } from './api';

let client: QueryClient | undefined;

function newClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        retry: (count, e) => !(e instanceof ApiError && e.status >= 400 && e.status < 500) && count < 2,
      },
    },
  });
}

export function queryClient(): QueryClient {
  if (typeof window === 'undefined') return newClient();
  client ??= newClient();
  return client;
}

export function QueryProvider({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={queryClient()}>{children}</QueryClientProvider>;
}
