interface PageHeaderProps {
  title: string;
  lead?: React.ReactNode;
  actions?: React.ReactNode;
}

/** Every page opens with one h1; the document title follows it. */
export function PageHeader({ title, lead, actions }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <title>{`${title} · Lumenwright`}</title>
      <div className="max-w-(--spacing-measure)">
        <h1 className="text-headline font-semibold text-ink">{title}</h1>
        {lead ? <p className="mt-1 text-lead text-ink-muted">{lead}</p> : null}
      </div>
      {actions ? <div className="flex gap-2">{actions}</div> : null}
    </header>
  );
}
