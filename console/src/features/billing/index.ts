export { BillingPage } from './components/billing-page';
