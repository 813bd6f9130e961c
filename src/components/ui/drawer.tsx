import type { ReactNode } from 'react';
import { useModal } from './use-modal.ts';

/** A panel sliding over the right edge, built on the native modal <dialog> (focus and Escape from the browser). */
export function Drawer({ open, title, onClose, children }: { open: boolean; title: ReactNode; onClose: () => void; children: ReactNode }) {
  const ref = useModal(open);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby="drawer-title"
      className="m-0 ml-auto h-dvh max-h-dvh w-full max-w-3xl border-l border-ash-200 bg-ash-50 p-0 shadow-2xl backdrop:bg-slag-950/40"
    >
      {open && (
        <div className="flex h-full flex-col">
          <header className="flex items-start justify-between gap-4 border-b border-ash-200 bg-white px-6 py-4">
            <h2 id="drawer-title" className="min-w-0 text-lg font-semibold">
              {title}
            </h2>
            <button type="button" onClick={onClose} className="rounded px-2 py-1 text-sm text-slag-500 hover:bg-ash-100" aria-label="Close">
              ✕
            </button>
          </header>
          <div className="flex-1 overflow-y-auto px-6 py-5">{children}</div>
        </div>
      )}
    </dialog>
  );
}
