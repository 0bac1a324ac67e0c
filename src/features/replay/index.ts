/** The Replay feature: a hedge replayed over simulated paths, and saved runs checked. */
export { ReplayPage } from './components/ReplayPage';
