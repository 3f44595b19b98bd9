import { createContext, useCallback, useContext, useMemo, useState, type ReactNode } from 'react';

interface Toast {
  id: number;
  kind: 'success' | 'error';
  message: string;
}

const ToastContext = createContext<(kind: Toast['kind'], message: string) => void>(() => undefined);

/** Shows short messages after actions (errors stay until dismissed). */
export function ToastProvider({ children }: { children: ReactNode }) {
  const [toasts, setToasts] = useState<Toast[]>([]);
  const dismiss = useCallback((id: number) => setToasts((all) => all.filter((t) => t.id !== id)), []);
  const push = useCallback(
    (kind: Toast['kind'], message: string) => {
      const id = Date.now() + Math.random();
      setToasts((all) => [...all.slice(-3), { id, kind, message }]);
      if (kind === 'success') setTimeout(() => dismiss(id), 4000);
    },
    [dismiss],
  );
  const value = useMemo(() => push, [push]);
  return (
    <ToastContext.Provider value={value}>
      {children}
      <div aria-live="polite" className="pointer-events-none fixed inset-x-0 bottom-4 z-50 flex flex-col items-center gap-2 px-4">
        {toasts.map((t) => (
          <div
            key={t.id}
            role={t.kind === 'error' ? 'alert' : 'status'}
            className={`pointer-events-auto flex max-w-md items-start gap-3 rounded-md border px-4 py-2 text-sm shadow ${t.kind === 'error' ? 'border-clay bg-card text-ink' : 'border-moss bg-card text-ink'}`}
          >
            <span className={t.kind === 'error' ? 'text-clay' : 'text-moss'}>{t.kind === 'error' ? '!' : '✓'}</span>
            <span className="flex-1">{t.message}</span>
            <button className="text-slate hover:text-ink" onClick={() => dismiss(t.id)} aria-label="Dismiss">
              ×
            </button>
          </div>
        ))}
      </div>
    </ToastContext.Provider>
  );
}

/** The toast function: toast('success', 'Saved'). */
export const useToast = () => useContext(ToastContext);
