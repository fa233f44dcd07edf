export { GearPage } from './components/gear-page';
