export { SetupsPage } from './components/setups-page';
export { UpcomingShoots } from './components/upcoming-shoots';
