// What the signed-in shell needs at first load, kept apart from the forms so those stay in their
// own route chunks.
export { SessionGate } from './components/session-gate';
export { UserMenu } from './components/user-menu';
