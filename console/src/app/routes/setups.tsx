import { SectionPage } from './section-page';

export default function SetupsRoute() {
  return (
    <SectionPage
      title="Setups"
      lead="Dusk setups saved from the playground, ready to reopen or print."
      coming={[
        'Save a setup with a name, venue, date and notes',
        'Search, duplicate, delete, reopen in the playground',
        'A printable shot sheet with the plan, diagram and cautions',
      ]}
    />
  );
}
