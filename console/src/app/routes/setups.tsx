import { PageHeader } from '@/components/layout/page-header';
import { SetupsPage } from '@/features/setups';

export default function SetupsRoute() {
  return (
    <>
      <PageHeader
        title="Setups"
        lead="Dusk setups saved by your studio, ready to reopen in the playground or print."
      />
      <SetupsPage />
    </>
  );
}
