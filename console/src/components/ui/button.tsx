type Variant = 'primary' | 'secondary' | 'quiet' | 'danger';

const variants: Record<Variant, string> = {
  primary: 'bg-accent text-on-accent hover:brightness-110 border border-transparent',
  secondary: 'bg-panel text-ink border border-edge-strong hover:bg-raised',
  quiet: 'bg-transparent text-ink border border-transparent hover:bg-raised',
  danger: 'bg-panel text-fault border border-fault hover:bg-raised',
};

type Size = 'md' | 'sm' | 'inline';

/**
 * Padding and type size. One class of each per size: Tailwind picks between two conflicting
 * utilities by stylesheet order, not class order, so overriding `px-4` through `className`
 * does not work.
 */
const sizes: Record<Size, string> = {
  md: 'px-4 py-2 text-body',
  sm: 'px-2 py-1 text-small',
  inline: 'p-0 text-body',
};

interface ButtonProps extends React.ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  /** `sm` for buttons in table rows beside the small action links; `inline` for text links. */
  size?: Size;
}

export function Button({
  variant = 'primary',
  size = 'md',
  className = '',
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-2 rounded-control font-medium transition disabled:cursor-not-allowed disabled:opacity-60 ${sizes[size]} ${variants[variant]} ${className}`}
      {...rest}
    />
  );
}
