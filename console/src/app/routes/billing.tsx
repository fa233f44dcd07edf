import { SectionPage } from './section-page';

export default function BillingRoute() {
  return (
    <SectionPage
      title="Billing"
      lead="Your plan, its limits and your invoices."
      coming={['Current plan and limits', 'Change plan and download invoices']}
    />
  );
}
