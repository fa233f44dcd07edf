import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/layout/page-header';
import { paths } from '@/config/paths';
import { OverviewUsage } from '@/features/usage';
import { useCan } from '@/lib/session';

const starts = [
  {
    to: paths.playground,
    title: 'Try the numbers',
    text: 'Twilight timing, background exposure, flash power, falloff and gels for tonight’s shoot.',
  },
  {
    to: paths.keys,
    title: 'Create an API key',
    text: 'Call the same calculations from your own app with the typed SDK.',
  },
  {
    to: paths.gear,
    title: 'List your gear',
    text: 'Lights, modifiers and gel kit, so the setup math uses what you actually carry.',
  },
];

export default function OverviewRoute() {
  const canReadUsage = useCan('usage:read');
  return (
    <>
      <PageHeader
        title="Overview"
        lead="Lighting math for flash portraits at dusk: when the light goes, and how to match it."
      />
      {canReadUsage ? (
        <div className="mb-8">
          <OverviewUsage usageHref={paths.usage} />
        </div>
      ) : null}
      <ul className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
        {starts.map((start) => (
          <li key={start.to}>
            <Card as="article" className="h-full">
              <h2 className="text-title font-semibold">
                <Link to={start.to}>{start.title}</Link>
              </h2>
              <p className="mt-2 text-ink-muted">{start.text}</p>
            </Card>
          </li>
        ))}
      </ul>
    </>
  );
}
