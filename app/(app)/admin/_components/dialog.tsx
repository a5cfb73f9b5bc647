"use client";

import { useEffect, useRef } from "react";

type Props = {
  title: string;
  /** One line under the title: whose record this is. */
  subtitle?: string;
  onClose: () => void;
  children: React.ReactNode;
  wide?: boolean;
};

/**
 * A modal side panel on the native <dialog>: focus is kept inside, Escape closes it, and the
 * page behind stays in place so the administrator does not lose their row.
 */
export function SidePanel({ title, subtitle, onClose, children, wide }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);

  return (
    <dialog
      ref={ref}
      aria-labelledby="panel-title"
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      onClick={(event) => {
        if (event.target === ref.current) onClose();
      }}
      className={`fixed inset-y-0 right-0 left-auto m-0 h-full max-h-none w-full ${wide ? "max-w-xl" : "max-w-md"} overflow-y-auto border-l border-ink-200 bg-white p-0 text-ink-900 shadow-xl backdrop:bg-ink-950/40 dark:border-ink-800 dark:bg-ink-900 dark:text-ink-100`}
    >
      <div className="sticky top-0 z-10 flex items-start justify-between gap-3 border-b border-ink-200 bg-white px-5 py-3 dark:border-ink-800 dark:bg-ink-900">
        <div>
          <h2 id="panel-title" className="text-base font-bold">
            {title}
          </h2>
          {subtitle && <p className="text-xs text-ink-500 dark:text-ink-400">{subtitle}</p>}
        </div>
        <button type="button" onClick={onClose} className="btn-quiet px-2 py-1" aria-label="Close">
          <span aria-hidden="true">×</span>
        </button>
      </div>
      <div className="px-5 py-4">{children}</div>
    </dialog>
  );
}
