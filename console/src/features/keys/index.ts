export { KeysPage } from './components/keys-page';
export { useKeyLabels, type KeyLabel } from './api/list-keys';
