export { AccountPage } from './components/account-page';
