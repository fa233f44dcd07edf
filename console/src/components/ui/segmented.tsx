import { Label, Radio, RadioGroup } from '@headlessui/react';

interface SegmentedProps<T extends string> {
  label: string;
  value: T;
  onChange: (value: T) => void;
  options: readonly { value: T; label: string; title?: string }[];
  className?: string;
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
            aria-label={option.title}
            className="cursor-pointer rounded-[calc(var(--radius-control)-2px)] px-3 py-1 text-small font-medium text-ink-muted data-checked:bg-accent data-checked:text-on-accent data-focus:outline-2 data-focus:outline-focus"
          >
            {option.label}
          </Radio>
        ))}
      </div>
    </RadioGroup>
  );
}
