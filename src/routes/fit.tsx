import { PagePlaceholder } from '../components/PagePlaceholder';

export function FitPage() {
  return (
    <PagePlaceholder title="Fit">
      <p>
        Upload an option chain (implied vols or prices), calibrate Heston, Bates, Merton or Heston
        with double-exponential jumps, and compare Heston with Bates on the same quotes by expiry
        bucket, to judge whether the three jump parameters earn their keep.
      </p>
    </PagePlaceholder>
  );
}
