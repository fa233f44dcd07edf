import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { curlSnippet, sdkSnippet } from '../utils/snippets';

interface CopySnippetsProps {
  path: string;
  body: unknown;
}

type Kind = 'curl' | 'sdk';

async function writeClipboard(text: string): Promise<boolean> {
  try {
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    return false;
  }
}

/** "Copy as curl" / "Copy as SDK call" for the current input; the code is also shown. */
export function CopySnippets({ path, body }: CopySnippetsProps) {
  const [shown, setShown] = useState<Kind | null>(null);
  const [copied, setCopied] = useState<string | null>(null);
  const origin = window.location.origin;
  const snippets: Record<Kind, string> = {
    curl: curlSnippet({ origin, path, body }),
    sdk: sdkSnippet({ origin, path, body }),
  };

  const copy = async (kind: Kind) => {
    setShown(kind);
    const ok = await writeClipboard(snippets[kind]);
    setCopied(
      ok
        ? `${kind === 'curl' ? 'curl command' : 'SDK call'} copied`
        : 'Copy blocked: select the code below',
    );
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <Button variant="secondary" onClick={() => void copy('curl')}>
          Copy as curl
        </Button>
        <Button variant="secondary" onClick={() => void copy('sdk')}>
          Copy as SDK call
        </Button>
        <span role="status" className="text-small text-ink-muted">
          {copied}
        </span>
      </div>
      {shown ? (
        <pre
          aria-label={shown === 'curl' ? 'curl command' : 'SDK call'}
          className="max-h-64 overflow-auto rounded-control border border-edge bg-raised p-3 font-mono text-caption text-ink"
        >
          <code>{snippets[shown]}</code>
        </pre>
      ) : null}
    </div>
  );
}
