import { Field, Label, Switch } from '@headlessui/react';
import { useTheme } from '@/lib/theme';

/** Night theme: deep, dim and red-leaning, for checking numbers on location after dark. */
export function ThemeToggle() {
  const [theme, setTheme] = useTheme();
  const night = theme === 'night';
  return (
    <Field className="flex items-center gap-2">
      <Switch
        checked={night}
        onChange={(on: boolean) => setTheme(on ? 'night' : 'day')}
        className="group relative inline-flex h-6 w-11 shrink-0 cursor-pointer items-center rounded-full border border-edge-strong bg-raised transition-colors data-checked:bg-accent"
      >
        <span
          aria-hidden="true"
          className="inline-block size-4 translate-x-1 rounded-full bg-ink transition-transform group-data-checked:translate-x-6 group-data-checked:bg-on-accent"
        />
      </Switch>
      <Label className="cursor-pointer text-small text-ink-muted">Night theme</Label>
    </Field>
  );
}
