export { StudioPage } from './components/studio-page';
