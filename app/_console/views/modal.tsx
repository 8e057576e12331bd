"use client";
/// A modal dialog on the native <dialog> element: it traps focus, closes on Escape and
/// gives focus back to where it came from; an element marked `data-autofocus` gets the
/// focus when it opens.
import { useEffect, useRef, type ReactNode } from "react";

/// Shows `children` in a modal while `open`; `onClose` runs on Escape or backdrop click.
export function Modal({ open, title, onClose, children }: { open: boolean; title: string; onClose: () => void; children: ReactNode }) {
  const ref = useRef<HTMLDialogElement>(null);
  // Closing because `open` went false (another dialog takes over) is not the user closing
  // this one: only a close while still meant to be open is reported.
  const meantOpen = useRef(open);
  meantOpen.current = open;
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) {
      d.showModal();
      // The children mounted (and tried to take focus) before the dialog was shown, when
      // nothing in it could be focused: give the focus to the one that asks for it now.
      d.querySelector<HTMLElement>("[data-autofocus]")?.focus();
    }
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-label={title}
      onClose={() => {
        if (meantOpen.current) onClose();
      }}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      onClick={(e) => {
        if (e.target === ref.current) onClose();
      }}
      className="w-[min(36rem,92vw)] rounded-lg border border-ink/20 bg-paper p-0 text-ink shadow-xl backdrop:bg-ink/40 dark:border-paper/20 dark:bg-night-panel dark:text-paper"
    >
      {open && (
        <div className="flex flex-col gap-3 p-5">
          <h2 className="text-base font-semibold">{title}</h2>
          {children}
        </div>
      )}
    </dialog>
  );
}
