/** `/library`: the Library page. */
import { LibraryPage } from '../features/library';

export default function LibraryRoute() {
  return <LibraryPage />;
}
