export { KeysPage } from './components/keys-page';
