// A table wider than its box that shows it: the first column stays in view (sticky), a shadow
// marks the edge where columns are hidden, and a line says "scroll sideways" while there is more.
import { useEffect, useRef, useState, type ReactNode } from 'react';

interface Overflow {
  left: boolean;
  right: boolean;
}

function useOverflow(ref: React.RefObject<HTMLDivElement | null>): Overflow {
  const [overflow, setOverflow] = useState<Overflow>({ left: false, right: false });
  useEffect(() => {
    const box = ref.current;
    if (!box) return;
    const measure = () => setOverflow({ left: box.scrollLeft > 0, right: Math.ceil(box.scrollLeft + box.clientWidth) < box.scrollWidth });
    measure();
    box.addEventListener('scroll', measure, { passive: true });
    const observer = new ResizeObserver(measure);
    observer.observe(box);
    if (box.firstElementChild) observer.observe(box.firstElementChild);
    return () => {
      box.removeEventListener('scroll', measure);
      observer.disconnect();
    };
  }, [ref]);
  return overflow;
}

export function ScrollingTable({
  label,
  head,
  caption,
  children,
}: {
  label: string;
  head: ReactNode[];
  caption: string;
  children: ReactNode;
}) {
  const box = useRef<HTMLDivElement>(null);
  const overflow = useOverflow(box);
  const scrolls = overflow.left || overflow.right;
  return (
    <div className="space-y-1">
      {scrolls && (
        <p className="text-xs text-slag-500" data-testid="scroll-hint">
          {overflow.right
            ? '↔ More columns to the right: scroll sideways (the first column stays in view).'
            : '↔ Scroll back for the first columns.'}
        </p>
      )}
      <div className="relative">
        <div
          ref={box}
          className="relative overflow-x-auto rounded-lg border border-ash-200 bg-white"
          role="region"
          aria-label={`${label}${scrolls ? ' (scrolls sideways)' : ''}`}
          tabIndex={scrolls ? 0 : undefined}
          data-scrolls={scrolls}
        >
          <table className="min-w-full text-left text-sm">
            <caption className="sr-only">{caption}</caption>
            <thead className="bg-ash-100 text-xs uppercase tracking-wide text-slag-500">
              <tr>
                {head.map((h, i) => (
                  <th key={i} scope="col" className={`px-3 py-2 font-semibold ${i === 0 ? 'sticky left-0 z-10 bg-ash-100' : ''}`}>
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody className="divide-y divide-ash-100">{children}</tbody>
          </table>
        </div>
        {overflow.right && (
          <div
            aria-hidden
            className="pointer-events-none absolute inset-y-0 right-0 w-8 rounded-r-lg bg-gradient-to-l from-slag-900/15 to-transparent"
          />
        )}
      </div>
    </div>
  );
}
