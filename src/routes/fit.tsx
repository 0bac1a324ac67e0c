/** `/fit`: the Fit page. */
import { FitPage } from '../features/fit';

export default function FitRoute() {
  return <FitPage />;
}
