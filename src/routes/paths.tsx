/** `/paths`: the Paths page. */
import { PathsPage } from '../features/paths';

export default function PathsRoute() {
  return <PathsPage />;
}
