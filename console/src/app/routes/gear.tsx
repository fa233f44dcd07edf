import { PageHeader } from '@/components/layout/page-header';
import { GearPage } from '@/features/gear';

export default function GearRoute() {
  return (
    <>
      <PageHeader title="Gear" lead="The lights, modifiers and gels your studio carries." />
      <GearPage />
    </>
  );
}
