/** `/replay`: the Replay page. */
import { ReplayPage } from '../features/replay';

export default function ReplayRoute() {
  return <ReplayPage />;
}
