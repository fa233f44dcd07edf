import { Label, Radio, RadioGroup } from '@headlessui/react';

interface SegmentedProps<T extends string> {
  label: string;
  value: T;
  onChange: (value: T) => void;
  options: readonly { value: T; label: string; title?: string }[];
  className?: string;
}

/**
 * The name a screen reader speaks and speech input matches: it starts with the visible text
 * (WCAG 2.1 SC 2.5.3), and spells out an abbreviation from its title ("ft (feet)").
 */
function spokenName(option: { label: string; title?: string }): string | undefined {
  if (!option.title || option.title === option.label) return undefined;
  return `${option.label} (${option.title.toLowerCase()})`;
}

/** A small radio group drawn as joined buttons (arrow keys move between options). */
export function Segmented<T extends string>({
  label,
  value,
  onChange,
  options,
  className = '',
}: SegmentedProps<T>) {
  return (
    <RadioGroup
      value={value}
      onChange={onChange}
      className={`flex items-center gap-2 ${className}`}
    >
      <Label className="text-small font-medium text-ink-muted">{label}</Label>
      <div className="inline-flex rounded-control border border-edge-strong p-0.5">
        {options.map((option) => (
          <Radio
            key={option.value}
            value={option.value}
            title={option.title}
            aria-label={spokenName(option)}
            className="cursor-pointer rounded-[calc(var(--radius-control)-2px)] px-3 py-1 text-small font-medium text-ink-muted data-checked:bg-accent data-checked:text-on-accent data-focus:outline-2 data-focus:outline-focus"
          >
            {option.label}
          </Radio>
        ))}
      </div>
    </RadioGroup>
  );
}
