import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/layout/page-header';
import { paths } from '@/config/paths';
import { UpcomingShoots } from '@/features/setups';
import { OverviewUsage } from '@/features/usage';
import { useSession } from '@/lib/session';

interface Start {
  to: string;
  title: string;
  text: string;
  /** Shown only to roles with this permission (everyone when absent). */
  permission?: string;
  /** Shown only to roles without it (the read-only variant of another card). */
  unless?: string;
}

const starts: Start[] = [
  {
    to: paths.playground,
    title: 'Try the numbers',
    text: 'Twilight timing, background exposure, flash power, falloff and gels for tonight’s shoot.',
  },
  {
    to: paths.keys,
    title: 'Create an API key',
    text: 'Call the same calculations from your own app with the typed SDK.',
    permission: 'keys:manage-own',
  },
  {
    to: paths.gear,
    title: 'List your gear',
    text: 'Lights, modifiers and gel kit, so the setup math uses what you actually carry.',
    permission: 'gear:manage',
  },
  {
    to: paths.gear,
    title: 'Your studio’s gear',
    text: 'The lights, modifiers and gels the setup math can use by name.',
    permission: 'gear:read',
    unless: 'gear:manage',
  },
  {
    to: paths.frames,
    title: 'Check a test frame',
    text: 'Upload a grey-card shot to read your light’s colour and the gel that neutralises it.',
  },
];

export default function OverviewRoute() {
  const session = useSession();
  const can = (permission?: string) => !permission || !!session?.permissions.includes(permission);
  const shown = starts.filter((s) => can(s.permission) && !(s.unless && can(s.unless)));
  return (
    <>
      <PageHeader
        title="Overview"
        lead="Lighting math for flash portraits at dusk: when the light goes, and how to match it."
      />
      {can('usage:read') ? (
        <div className="mb-8">
          <OverviewUsage usageHref={paths.usage} />
        </div>
      ) : null}
      {can('setups:read') ? (
        <div className="mb-8">
          <UpcomingShoots />
        </div>
      ) : null}
      <ul className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
        {shown.map((start) => (
          <li key={start.title}>
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
