export { FramesPage } from './components/frames-page';
