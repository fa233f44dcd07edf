import { PageHeader } from '@/components/layout/page-header';
import { Playground } from '@/features/playground';

export default function PlaygroundRoute() {
  return (
    <>
      <PageHeader
        title="Playground"
        lead="Plan a dusk portrait: when the light goes, what the background needs, and how to match it with flash."
      />
      <Playground />
    </>
  );
}
