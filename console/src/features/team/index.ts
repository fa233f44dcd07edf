export { TeamPage } from './components/team-page';
