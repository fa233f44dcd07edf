import { Dialog as HeadlessDialog, DialogPanel, DialogTitle, Description } from '@headlessui/react';

interface DialogProps {
  open: boolean;
  onClose: () => void;
  title: string;
  description?: React.ReactNode;
  children: React.ReactNode;
}

/** A modal dialog (Headless UI): focus is trapped inside and Escape closes it. */
export function Dialog({ open, onClose, title, description, children }: DialogProps) {
  return (
    <HeadlessDialog open={open} onClose={onClose} className="relative z-50">
      <div className="fixed inset-0 bg-canvas/80" aria-hidden="true" />
      <div className="fixed inset-0 flex items-start justify-center overflow-y-auto p-4 sm:items-center">
        <DialogPanel className="w-full max-w-lg rounded-card border border-edge-strong bg-panel p-5 shadow-lg">
          <DialogTitle className="text-title font-semibold text-ink">{title}</DialogTitle>
          {description ? (
            <Description className="mt-1 text-small text-ink-muted">{description}</Description>
          ) : null}
          <div className="mt-4">{children}</div>
        </DialogPanel>
      </div>
    </HeadlessDialog>
  );
}
