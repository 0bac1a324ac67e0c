/** The Paths feature: Monte Carlo paths simulated and inspected. */
export { PathsPage } from './components/PathsPage';
