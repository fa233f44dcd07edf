import { PageHeader } from '@/components/layout/page-header';
import { FramesPage } from '@/features/frames';
import { useCurrentPlan } from '@/features/usage';

export default function FramesRoute() {
  const current = useCurrentPlan();
  const plan = current.data
    ? { name: current.data.plan.name, uploads: current.data.plan.features.uploads }
    : undefined;
  return (
    <>
      <PageHeader
        title="Test frames"
        lead="Upload a test shot to read the colour of your light: CCT, Duv, the mired offset and the gel or white-balance change that neutralises it."
      />
      <FramesPage plan={plan} />
    </>
  );
}
