"use client";

import { useEffect, useId, useRef } from "react";

type SidePanelProps = {
  title: string;
  /** One line under the title: whose record this is. */
  subtitle?: string;
  onClose: () => void;
  children: React.ReactNode;
  /** Room for two columns of fields. */
  wide?: boolean;
  /** A click on the dimmed page beside the panel closes it too. */
  closeOnBackdrop?: boolean;
};

/**
 * A panel at the right edge on the native modal <dialog>: it keeps focus inside, closes on Escape,
 * gives focus back to the button that opened it, and leaves the page behind in place so nobody
 * loses their row.
 */
export function SidePanel({ title, subtitle, onClose, children, wide, closeOnBackdrop }: SidePanelProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const body = useRef<HTMLDivElement>(null);
  const titleId = useId();

  useEffect(() => {
    const dialog = ref.current;
    const opener = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    if (dialog && !dialog.open) dialog.showModal();
    // showModal puts focus on the first focusable element, the Close button; a person opening a
    // form wants to type, so the first field takes focus instead.
    body.current
      ?.querySelector<HTMLElement>("input:not([type=hidden]):not([disabled]), select:not([disabled]), textarea:not([disabled])")
      ?.focus();
    return () => {
      dialog?.close();
      opener?.focus();
    };
  }, []);

  // The backdrop belongs to the <dialog> element, and so does the panel's own empty space below
  // its content: only a click outside the panel's box is on the backdrop.
  function onBackdropClick(event: React.MouseEvent<HTMLDialogElement>) {
    if (event.target !== ref.current) return;
    const box = ref.current.getBoundingClientRect();
    const inside =
      event.clientX >= box.left &&
      event.clientX <= box.right &&
      event.clientY >= box.top &&
      event.clientY <= box.bottom;
    if (!inside) onClose();
  }

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      onClick={closeOnBackdrop ? onBackdropClick : undefined}
      className={`fixed inset-y-0 right-0 left-auto m-0 h-full max-h-none w-full ${wide ? "max-w-xl" : "max-w-md"} overflow-y-auto border-l border-ink-200 bg-white p-0 text-ink-900 shadow-xl backdrop:bg-ink-950/40 dark:border-ink-800 dark:bg-ink-900 dark:text-ink-100`}
    >
      <div className="sticky top-0 z-10 flex items-start justify-between gap-3 border-b border-ink-200 bg-white px-4 py-3 dark:border-ink-800 dark:bg-ink-900">
        <div>
          <h2 id={titleId} className="text-base font-semibold">
            {title}
          </h2>
          {subtitle && <p className="text-xs text-ink-500 dark:text-ink-400">{subtitle}</p>}
        </div>
        <button type="button" className="btn-quiet px-2 py-1" onClick={onClose}>
          Close
        </button>
      </div>
      <div ref={body} className="p-4">
        {children}
      </div>
    </dialog>
  );
}
