'use client';

import { useEffect, useId, useRef } from 'react';

/**
 * A panel that slides up from the bottom of the screen over the lower part of the page, leaving
 * the map above it usable (not modal). Takes the focus when it opens, gives it back when it
 * closes; Escape closes it.
 */
export function BottomSheet({ title, onClose, children }: { title: string; onClose: () => void; children: React.ReactNode }) {
  const headingId = useId();
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    const opener = document.activeElement as HTMLElement | null;
    heading.current?.focus();
    return () => opener?.focus?.();
  }, []);
  return (
    <div
      role="dialog"
      aria-modal="false"
      aria-labelledby={headingId}
      className="fixed inset-x-0 bottom-0 z-[1100] mx-auto max-h-[72dvh] w-full max-w-2xl overflow-y-auto overscroll-contain rounded-t-2xl border-t-4 border-hush-700 bg-white px-4 pt-2 shadow-[0_-8px_24px_rgba(15,29,43,0.25)]"
      onKeyDown={(e) => {
        if (e.key === 'Escape') onClose();
      }}
    >
      <div className="sticky top-0 z-10 -mx-4 flex items-center justify-between gap-2 border-b border-ink/10 bg-white px-4 py-1">
        <h2 id={headingId} ref={heading} tabIndex={-1} className="text-xl font-extrabold outline-none">
          {title}
        </h2>
        <button type="button" className="btn-quiet min-w-11" onClick={onClose}>
          Close
        </button>
      </div>
      <div className="py-3">{children}</div>
    </div>
  );
}
