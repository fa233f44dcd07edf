import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/layout/page-header';

interface SectionPageProps {
  title: string;
  lead: string;
  /** What this section will hold, shown until its feature lands. */
  coming: string[];
}

/** The frame of a section whose feature has not landed yet: heading, purpose, and its plan. */
export function SectionPage({ title, lead, coming }: SectionPageProps) {
  return (
    <>
      <PageHeader title={title} lead={lead} />
      <Card aria-labelledby="section-plan">
        <h2 id="section-plan" className="text-title font-semibold">
          Not built yet
        </h2>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-muted">
          {coming.map((item) => (
            <li key={item}>{item}</li>
          ))}
        </ul>
      </Card>
    </>
  );
}
