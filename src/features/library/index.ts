/** The Library feature: scenarios and scenario sets, local and shared, with their sync state. */
export { LibraryPage } from './components/LibraryPage';
