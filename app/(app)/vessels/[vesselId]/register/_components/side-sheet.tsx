"use client";

import { useEffect, useId, useRef } from "react";

type Props = { title: string; subtitle?: React.ReactNode; onClose: () => void; children: React.ReactNode };

/**
 * A form beside the register, on the native modal <dialog>: it keeps focus inside, closes on
 * Escape, and gives focus back to the button that opened it.
 */
export function SideSheet({ title, subtitle, onClose, children }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();

  useEffect(() => {
    const dialog = ref.current;
    const opener = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    dialog?.showModal();
    return () => {
      dialog?.close();
      opener?.focus();
    };
  }, []);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className="fixed inset-y-0 right-0 left-auto m-0 h-full max-h-none w-full max-w-md overflow-y-auto border-l border-ink-200 bg-white p-0 text-ink-900 shadow-xl backdrop:bg-ink-950/40 dark:border-ink-800 dark:bg-ink-900 dark:text-ink-100"
    >
      <div className="sticky top-0 z-10 flex items-start justify-between gap-3 border-b border-ink-200 bg-white px-4 py-3 dark:border-ink-800 dark:bg-ink-900">
        <div>
          <h2 id={titleId} className="text-base font-semibold">
            {title}
          </h2>
          {subtitle && <div className="text-xs text-ink-500 dark:text-ink-400">{subtitle}</div>}
        </div>
        <button type="button" className="btn-quiet px-2 py-1" onClick={onClose}>
          Close
        </button>
      </div>
      <div className="p-4">{children}</div>
    </dialog>
  );
}
