import type { ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '../lib/query-client';
import { ToastProvider } from '../components/ui/toast';
import { UpdatePrompt } from '../components/ui/update-prompt';

/** Everything the app needs around its routes. */
export function AppProvider({ children }: { children: ReactNode }) {
  return (
    <QueryClientProvider client={queryClient}>
      <ToastProvider>
        {children}
        <UpdatePrompt />
      </ToastProvider>
    </QueryClientProvider>
  );
}
