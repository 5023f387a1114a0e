"use client";

import { useEffect, useId, useRef } from "react";

export interface ConfirmDialogProps {
  /** Shown while true; closing (Escape, Cancel, confirm) calls onCancel or onConfirm. */
  open: boolean;
  title: string;
  children?: React.ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  /** "danger" for removals and revocations, "primary" for changes that can be undone. */
  tone?: "danger" | "primary";
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}

/**
 * The one confirmation for actions that lose or replace something. A native modal <dialog>:
 * the browser keeps focus inside it, makes the page behind it inert and cancels on Escape; we
 * put focus back on the button that opened it, since an unmounting row may not do it for us.
 */
export function ConfirmDialog({ open, title, children, confirmLabel, cancelLabel = "Cancel", tone = "danger", busy, onConfirm, onCancel }: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const opener = useRef<HTMLElement | null>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      opener.current = document.activeElement instanceof HTMLElement ? document.activeElement : null;
      dialog.showModal();
    } else if (!open && dialog.open) {
      dialog.close();
      if (opener.current?.isConnected) opener.current.focus();
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={children ? bodyId : undefined}
      className="w-[min(28rem,calc(100vw-2rem))] rounded-lg border border-line bg-white p-0 text-ink shadow-xl backdrop:bg-black/30"
      onCancel={(e) => {
        // Escape: keep React the owner of open/closed, so the effect restores focus.
        e.preventDefault();
        if (!busy) onCancel();
      }}
      data-testid="confirm-dialog"
    >
      {open ? (
        <div className="space-y-3 p-4">
          <h2 id={titleId} className="text-base font-semibold">
            {title}
          </h2>
          {children ? (
            <div id={bodyId} className="text-sm text-ink-soft">
              {children}
            </div>
          ) : null}
          <div className="flex justify-end gap-2 pt-1">
            <button type="button" className="btn-quiet" onClick={onCancel} disabled={busy} autoFocus>
              {cancelLabel}
            </button>
            <button type="button" className={tone === "danger" ? "btn-danger" : "btn-primary"} onClick={onConfirm} disabled={busy}>
              {confirmLabel}
            </button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
