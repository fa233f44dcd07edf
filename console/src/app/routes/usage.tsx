import { SectionPage } from './section-page';

export default function UsageRoute() {
  return (
    <SectionPage
      title="Usage"
      lead="Calls your keys made, by day and by endpoint, against your plan."
      coming={['Daily calls per key and per calculation', 'How close you are to the plan limit']}
    />
  );
}
