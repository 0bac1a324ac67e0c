/** `/book`: the Book page. */
import { BookPage } from '../features/book';

export default function BookRoute() {
  return <BookPage />;
}
