type Tone = 'info' | 'ok' | 'caution' | 'fault';

const tones: Record<Tone, string> = {
  info: 'border-edge-strong text-ink',
  ok: 'border-ok text-ok',
  caution: 'border-caution text-caution',
  fault: 'border-fault text-fault',
};

interface NoticeProps {
  tone?: Tone;
  children: React.ReactNode;
  className?: string;
}

/** A bordered message; faults are announced to screen readers as alerts. */
export function Notice({ tone = 'info', children, className = '' }: NoticeProps) {
  return (
    <div
      role={tone === 'fault' ? 'alert' : 'status'}
      className={`rounded-control border-l-4 bg-raised px-3 py-2 text-small ${tones[tone]} ${className}`}
    >
      {children}
    </div>
  );
}
