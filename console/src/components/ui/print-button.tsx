import { Button } from './button';

interface PrintButtonProps {
  /** What gets printed, in plain words ("Print this plan"). */
  label: string;
  className?: string;
}

/**
 * Opens the browser's print dialog for the page as it is. The button itself stays off the paper
 * (`print:hidden` here, and print.css hides every button).
 */
export function PrintButton({ label, className = '' }: PrintButtonProps) {
  return (
    <Button
      variant="secondary"
      className={`print:hidden ${className}`}
      onClick={() => window.print()}
    >
      {label}
    </Button>
  );
}
