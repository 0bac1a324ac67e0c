/** `/desk`: the Desk page. */
import { DeskPage } from '../features/desk';

export default function DeskRoute() {
  return <DeskPage />;
}
