import { useState } from 'react';
import { Button } from './button';

interface CopyButtonProps {
  text: string;
  label?: string;
  /** The button's accessible name when `label` alone is ambiguous (a copy button per row). */
  ariaLabel?: string;
  className?: string;
  size?: 'md' | 'sm';
}

/** Copies `text` to the clipboard and says so; falls back to asking the user to copy by hand. */
export function CopyButton({
  text,
  label = 'Copy',
  ariaLabel,
  className,
  size = 'md',
}: CopyButtonProps) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setState('copied');
    } catch {
      setState('failed');
    }
  };
  return (
    <span className="inline-flex items-center gap-2">
      <Button
        variant="secondary"
        size={size}
        className={className}
        aria-label={ariaLabel}
        onClick={() => void copy()}
      >
        {label}
      </Button>
      <span role="status" className="text-small text-ink-muted">
        {state === 'copied' ? 'Copied' : state === 'failed' ? 'Select the text and copy it' : ''}
      </span>
    </span>
  );
}
