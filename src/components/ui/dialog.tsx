import type { ReactNode } from 'react';
import { useModal } from './use-modal.ts';

/** A modal built on the native <dialog>: focus trapping and Escape come from the browser. */
export function Dialog({ open, title, onClose, children }: { open: boolean; title: string; onClose: () => void; children: ReactNode }) {
  const ref = useModal(open);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby="dialog-title"
      className="m-auto w-full max-w-lg rounded-lg border border-ash-200 p-0 shadow-xl backdrop:bg-slag-950/50"
    >
      {open && (
        <div className="p-6">
          <h2 id="dialog-title" className="mb-4 text-lg font-semibold">
            {title}
          </h2>
          {children}
        </div>
      )}
    </dialog>
  );
}
