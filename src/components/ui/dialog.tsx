import type { ReactNode } from 'react';
import { Button } from './button.tsx';
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

/** The button row at the foot of a dialog or dialog form: actions on the right, or spread across with `spread`. */
export function DialogFooter({ children, spread = false }: { children: ReactNode; spread?: boolean }) {
  return <div className={`flex gap-2 ${spread ? 'justify-between' : 'justify-end'}`}>{children}</div>;
}

/** A yes/no question before a change that cannot be undone. */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  cancelLabel = 'Cancel',
  busy = false,
  onConfirm,
  onClose,
}: {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  busy?: boolean;
  onConfirm: () => void;
  onClose: () => void;
}) {
  return (
    <Dialog open={open} title={title} onClose={onClose}>
      <div className="mb-4 space-y-2 text-sm">{children}</div>
      <DialogFooter>
        <Button variant="secondary" onClick={onClose}>
          {cancelLabel}
        </Button>
        <Button variant="danger" onClick={onConfirm} disabled={busy}>
          {confirmLabel}
        </Button>
      </DialogFooter>
    </Dialog>
  );
}
