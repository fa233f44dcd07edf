import { SectionPage } from './section-page';

export default function PlaygroundRoute() {
  return (
    <SectionPage
      title="Playground"
      lead="Try the lighting math for a dusk portrait and see the results drawn."
      coming={[
        'Twilight timeline with ambient light',
        'Flash power, falloff, backlight and gel balance',
        'The whole dusk setup with diagrams and cautions',
      ]}
    />
  );
}
