export { Playground } from './components/playground';
