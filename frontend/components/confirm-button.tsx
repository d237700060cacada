import { useId, useRef, type ReactNode } from 'react';

/**
 * A button whose action waits for a second yes: it opens a modal dialog (the browser's own
 * <dialog>, so the page behind is inert and Escape cancels) that says what will happen, with the
 * focus on "Cancel" so a stray Enter changes nothing. Focus goes back to the button afterwards.
 */
export function ConfirmButton({
  children,
  className,
  title,
  description,
  confirmLabel,
  onConfirm,
  disabled,
}: {
  /** The button's own text. */
  children: ReactNode;
  className?: string;
  /** The question, e.g. "Revoke the key “line 3 tooling”?" */
  title: string;
  /** What follows, in a sentence or two. */
  description: ReactNode;
  /** The confirming button's text, e.g. "Revoke the key". */
  confirmLabel: string;
  onConfirm: () => void;
  disabled?: boolean;
}) {
  const dialog = useRef<HTMLDialogElement>(null);
  const trigger = useRef<HTMLButtonElement>(null);
  const keep = useRef<HTMLButtonElement>(null);
  const id = useId();
  return (
    <>
      <button
        ref={trigger}
        type="button"
        className={className}
        disabled={disabled}
        aria-haspopup="dialog"
        onClick={() => {
          dialog.current?.showModal();
          keep.current?.focus();
        }}
      >
        {children}
      </button>
      <dialog
        ref={dialog}
        aria-labelledby={`${id}-title`}
        aria-describedby={`${id}-text`}
        className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-md border border-patina-300 bg-white p-5 text-left text-sm text-ink shadow-lg backdrop:bg-ink/40"
        onClose={() => trigger.current?.focus()}
      >
        <h2 id={`${id}-title`} className="text-base font-semibold">
          {title}
        </h2>
        <div id={`${id}-text`} className="mt-2">
          {description}
        </div>
        <div className="mt-4 flex flex-wrap justify-end gap-2">
          <button
            ref={keep}
            type="button"
            className="rounded border border-patina-300 px-3 py-1.5 hover:bg-patina-50"
            onClick={() => dialog.current?.close()}
          >
            Cancel
          </button>
          <button
            type="button"
            className="rounded bg-copper-500 px-3 py-1.5 font-medium text-white hover:bg-copper-700"
            onClick={() => {
              dialog.current?.close();
              onConfirm();
            }}
          >
            {confirmLabel}
          </button>
        </div>
      </dialog>
    </>
  );
}
