import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { Alert } from './alert';
import { Button, type ButtonProps } from './button';

interface ConfirmDialogProps {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  tone?: 'primary' | 'danger';
  pending?: boolean;
  error?: string | null;
  onConfirm: () => void;
  onCancel: () => void;
}

/**
 * A modal question before an action that cannot be undone. Built on the native <dialog>: focus
 * stays inside while it is open, Escape cancels, and focus goes back to what opened it.
 * The safe choice (Cancel) has the focus first.
 */
export function ConfirmDialog({ open, title, children, confirmLabel, cancelLabel, tone = 'primary', pending, error, onConfirm, onCancel }: ConfirmDialogProps) {
  const { t } = useTranslation();
  const ref = useRef<HTMLDialogElement>(null);
  const opener = useRef<Element | null>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      opener.current = document.activeElement;
      dialog.showModal();
    } else if (!open && dialog.open) {
      dialog.close();
      if (opener.current instanceof HTMLElement) opener.current.focus();
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onCancel={(e) => {
        e.preventDefault();
        if (!pending) onCancel();
      }}
      className="m-auto w-[min(30rem,calc(100vw-2rem))] rounded-card border border-sand-200 bg-white p-0 text-ink shadow-xl backdrop:bg-ink/50"
    >
      {open ? (
        <div className="space-y-4 p-5 sm:p-6">
          <h2 id={titleId}>{title}</h2>
          <div id={bodyId} className="space-y-2 text-ink-muted">
            {children}
          </div>
          {error ? <Alert tone="error">{error}</Alert> : null}
          <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
            <Button variant="secondary" size="lg" className="sm:h-11 sm:text-base" autoFocus onClick={onCancel} disabled={pending}>
              {cancelLabel ?? t(($) => $.actions.cancel)}
            </Button>
            <Button variant={tone} size="lg" className="sm:h-11 sm:text-base" onClick={onConfirm} disabled={pending}>
              {pending ? t(($) => $.actions.working) : confirmLabel}
            </Button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}

interface ConfirmActionProps {
  /** The button that opens the question. */
  label: ReactNode;
  /** Accessible name for the opening button when the label alone is ambiguous (e.g. in a table row). */
  ariaLabel?: string;
  buttonProps?: Omit<ButtonProps, 'onClick' | 'children'>;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  tone?: 'primary' | 'danger';
  /** Runs the action; a thrown error's message is shown in the dialog, which stays open. */
  onConfirm: () => Promise<unknown>;
}

/** A button that asks first, then runs the action and reports a failure in place. */
export function ConfirmAction({ label, ariaLabel, buttonProps, title, children, confirmLabel, tone = 'primary', onConfirm }: ConfirmActionProps) {
  const { t } = useTranslation();
  const [open, setOpen] = useState(false);
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const run = async () => {
    setPending(true);
    setError(null);
    try {
      await onConfirm();
      setOpen(false);
    } catch (err) {
      setError(err instanceof Error ? err.message : t(($) => $.apiErrors.unexpected));
    } finally {
      setPending(false);
    }
  };
  return (
    <>
      <Button
        variant="secondary"
        aria-label={ariaLabel}
        {...buttonProps}
        onClick={() => {
          setError(null);
          setOpen(true);
        }}
      >
        {label}
      </Button>
      <ConfirmDialog
        open={open}
        title={title}
        confirmLabel={confirmLabel}
        tone={tone}
        pending={pending}
        error={error}
        onConfirm={() => void run()}
        onCancel={() => setOpen(false)}
      >
        {children}
      </ConfirmDialog>
    </>
  );
}
