import { SectionPage } from './section-page';

export default function TeamRoute() {
  return (
    <SectionPage
      title="Team"
      lead="People in your studio and what each may do."
      coming={['Invite people by email', 'Change roles or remove access']}
    />
  );
}
