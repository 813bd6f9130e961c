import { useEffect, useRef } from 'react';

/** Opens and closes a native <dialog> as a modal with `open`: focus trapping and Escape come from the browser. */
export function useModal(open: boolean) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return ref;
}
