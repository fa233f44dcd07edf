import { Button } from '@/components/ui/button';
import { CopyButton } from '@/components/ui/copy-button';
import { Notice } from '@/components/ui/notice';

interface SecretRevealProps {
  secret: string;
  onDone: () => void;
}

/** The one and only showing of a key's secret. */
export function SecretReveal({ secret, onDone }: SecretRevealProps) {
  return (
    <div className="flex flex-col gap-3">
      <Notice tone="caution">
        Copy this secret now and store it somewhere safe (a secrets manager or your app’s
        environment). It is shown only once: we keep just a hash and cannot show it again. If you
        lose it, rotate the key.
      </Notice>
      <label className="flex flex-col gap-1 text-small font-medium text-ink">
        Secret
        <input
          readOnly
          value={secret}
          onFocus={(event) => event.currentTarget.select()}
          data-testid="key-secret"
          className="rounded-control border border-edge-strong bg-raised px-3 py-2 font-mono text-small break-all text-ink"
        />
      </label>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <CopyButton text={secret} label="Copy secret" />
        <Button onClick={onDone}>I have stored it</Button>
      </div>
    </div>
  );
}
