import { SectionPage } from './section-page';

export default function KeysRoute() {
  return (
    <SectionPage
      title="Keys"
      lead="API keys let your apps call Lumenwright; each key belongs to your studio."
      coming={[
        'Create a key, copy it once, name it by app',
        'Revoke a key and see when each was last used',
      ]}
    />
  );
}
