import { PagePlaceholder } from '../components/PagePlaceholder';

export function BookPage() {
  return (
    <PagePlaceholder title="Book">
      <p>
        Upload the desk&apos;s positions (European calls, puts and underlying holdings) and revalue
        them under every scenario of a set: value and Greeks by leg, the P&amp;L of each scenario
        against base, and the gap ladder — the book&apos;s P&amp;L for instant moves of the
        underlying, revalued through each scenario&apos;s model.
      </p>
    </PagePlaceholder>
  );
}
