import { PageHeader } from '@/components/layout/page-header';
import { FramesPage } from '@/features/frames';

export default function FramesRoute() {
  return (
    <>
      <PageHeader
        title="Test frames"
        lead="Upload a test shot to read the colour of your light: CCT, Duv, the mired offset and the gel or white-balance change that neutralises it."
      />
      <FramesPage />
    </>
  );
}
