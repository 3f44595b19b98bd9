import type { ReactNode } from 'react';
import { Brand } from '../../../components/layouts/brand';

/** One centred card on paper, the product name above it. */
export function AuthCard({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen items-center justify-center px-4 py-10">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex justify-center">
          <Brand size="lg" />
        </div>
        <div className="rounded-md border border-rule bg-card p-6 shadow-sm">
          <h1 className="mb-4 text-xl font-bold">{title}</h1>
          {children}
        </div>
        <p className="mt-6 text-center text-xs text-slate">Habitat plans, proposals and progress for landowners and their consultants.</p>
      </div>
    </div>
  );
}
