/** `/`: the Sketch page. */
import { SketchPage } from '../features/sketch';

export default function SketchRoute() {
  return <SketchPage />;
}
