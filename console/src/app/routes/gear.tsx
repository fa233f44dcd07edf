import { SectionPage } from './section-page';

export default function GearRoute() {
  return (
    <SectionPage
      title="Gear"
      lead="The lights, modifiers and gels your studio carries."
      coming={[
        'Lights with a guide number or a meter reading',
        'Modifiers and their light loss',
        'Gel kit pieces with mired shift and light loss',
      ]}
    />
  );
}
