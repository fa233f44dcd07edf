export { SetupsPage } from './components/setups-page';
